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
}
