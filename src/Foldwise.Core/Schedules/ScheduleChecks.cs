using Foldwise.Core.Definition;

namespace Foldwise.Core.Schedules;

/// <summary>The budget settings every schedule relies on: 1 ≤ MinBudget ≤ MaxBudget and η ≥ 2.</summary>
internal static class ScheduleChecks
{
    public static void Validate(ScheduleOptions options) => Validate(options.MinBudget, options.MaxBudget, options.Eta);

    public static void Validate(int minBudget, int maxBudget, int eta)
    {
        if (minBudget < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(minBudget), minBudget, "the minimum budget must be at least 1");
        }

        if (maxBudget < minBudget)
        {
            throw new ArgumentOutOfRangeException(nameof(maxBudget), maxBudget, $"the maximum budget must be at least the minimum ({minBudget})");
        }

        if (eta < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(eta), eta, "eta must be at least 2");
        }
    }
}
