using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>The budgets of successive-halving rungs: MinBudget·ηᵏ while below MaxBudget, then MaxBudget as the last rung.</summary>
public static class RungBudgets
{
    /// <summary>E.g. 25, 75, 225, 400 for the defaults (25 to 400 rounds, η = 3).</summary>
    public static ImmutableArray<int> For(int minBudget, int maxBudget, int eta)
    {
        ScheduleChecks.Validate(minBudget, maxBudget, eta);
        var budgets = ImmutableArray.CreateBuilder<int>();
        for (long b = minBudget; b < maxBudget; b *= eta)
        {
            budgets.Add((int)b);
        }

        budgets.Add(maxBudget);
        return budgets.ToImmutable();
    }
}
