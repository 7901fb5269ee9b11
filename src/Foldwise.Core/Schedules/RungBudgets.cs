using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>The budgets of successive-halving rungs: FirstRung·ηᵏ while below FullBudget, then FullBudget as the last rung.</summary>
public static class RungBudgets
{
    /// <summary>E.g. 25, 75, 225, 400 for the defaults (25 to 400 rounds, η = 3).</summary>
    public static ImmutableArray<int> For(int firstRung, int fullBudget, int eta)
    {
        ScheduleChecks.Validate(firstRung, fullBudget, eta);
        var budgets = ImmutableArray.CreateBuilder<int>();
        for (long b = firstRung; b < fullBudget; b *= eta)
        {
            budgets.Add((int)b);
        }

        budgets.Add(fullBudget);
        return budgets.ToImmutable();
    }

    /// <summary>
    /// What a trial at a rung trains: the rung's budget on every fold (folds 0), or, when rungs count folds
    /// (<paramref name="foldCount"/> above 0), the family's full budget on the rung's first folds (0 at the top: all).
    /// </summary>
    public static (int Budget, int Folds) Training(int rung, int fullBudget, int foldCount) =>
        foldCount == 0 ? (rung, 0) : (fullBudget, rung < foldCount ? rung : 0);
}
