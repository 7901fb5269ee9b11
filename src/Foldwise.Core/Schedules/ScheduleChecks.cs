using Foldwise.Core.Definition;

namespace Foldwise.Core.Schedules;

/// <summary>The budget settings every schedule relies on: 1 ≤ FirstRung ≤ FullBudget and η ≥ 2.</summary>
internal static class ScheduleChecks
{
    public static void Validate(ScheduleOptions options) => Validate(options.FirstRung, options.FullBudget, options.Eta);

    public static void Validate(int firstRung, int fullBudget, int eta)
    {
        if (firstRung < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(firstRung), firstRung, "the first rung's budget must be at least 1");
        }

        if (fullBudget < firstRung)
        {
            throw new ArgumentOutOfRangeException(nameof(fullBudget), fullBudget, $"the full budget must be at least the first rung's ({firstRung})");
        }

        if (eta < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(eta), eta, "eta must be at least 2");
        }
    }

    /// <summary>A screen on folds must leave folds to promote to.</summary>
    public static void ValidateScreen(ScheduleOptions options, int folds)
    {
        if (options.ByFolds && options.ScreenFolds >= folds)
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.ScreenFolds, $"screening on folds needs fewer than the plan's {folds} folds");
        }
    }
}
