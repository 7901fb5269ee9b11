using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;

namespace Foldwise.Core.Search;

/// <summary>
/// A search that screens on folds may stop (its trial budget, or a schedule with nothing more to give) before any
/// candidate of a family has trained every fold, and a screened trial can never be blended. So once such a family has
/// nothing running or queued, its best screened candidate (the most folds, then the best score) is promoted to every
/// fold: at most one trial per family past the budget, and a family that already has one gets none. A search stopped
/// by its hours budget before any family trained every fold gets one such promotion only, of the best screen of all
/// (screens on the same folds score the same rows), which runs past the hours; with any trial on every fold it gets none.
/// </summary>
internal static class ScreenFinish
{
    /// <summary>What a search stopped for <paramref name="stopping"/> still needs queued so that it has something to blend.</summary>
    public static IReadOnlyList<TrialPlan> Needed(SearchDefinition definition, StopReason? stopping, IReadOnlyCollection<TrialRecord> trials)
    {
        if (!definition.Schedule.ByFolds)
        {
            return [];
        }

        int FullBudget(string family) => definition.BudgetOf(family).FullBudget;
        return stopping switch
        {
            StopReason.HoursBudget => AfterHours(trials, definition.Folds, definition.Schedule, FullBudget) is { } plan ? [plan] : [],
            StopReason.TrialBudget or StopReason.ScheduleExhausted =>
                [.. definition.Families.Select(f => For(f.Family, trials, definition.Folds, definition.Schedule, FullBudget(f.Family))).OfType<TrialPlan>()],
            _ => [],
        };
    }

    /// <summary>The promotion <paramref name="family"/> still needs, or null.</summary>
    private static TrialPlan? For(string family, IEnumerable<TrialRecord> trials, int folds, ScheduleOptions schedule, int fullBudget)
    {
        var own = trials.Where(t => t.Family == family).ToList();
        if (own.Any(t => t.State is TrialState.Running or TrialState.Queued || (t.AllFolds && t.State == TrialState.Done)))
        {
            return null;
        }

        var promoted = own.Where(t => t.ParentId is not null).Select(t => t.ParentId!.Value).ToHashSet();
        var best = own.Where(t => t.State == TrialState.Done && !t.AllFolds && t.Score is not null && !promoted.Contains(t.Id))
            .OrderByDescending(t => t.Folds).ThenBy(t => t.Score).ThenBy(t => t.Id).FirstOrDefault();
        if (best is null)
        {
            return null;
        }

        int top = RungBudgets.For(schedule.ScreenFolds, folds, schedule.Eta).Length - 1;
        return new TrialPlan(family, best.Parameters, fullBudget, top, best.Id, Promotion.ProposerName, best.Bracket, Folds: 0);
    }

    /// <summary>The one promotion a search stopped by its hours budget still needs, or null.</summary>
    private static TrialPlan? AfterHours(IReadOnlyCollection<TrialRecord> trials, int folds, ScheduleOptions schedule, Func<string, int> fullBudget)
    {
        if (trials.Any(t => t.State == TrialState.Running || (t.AllFolds && t.State is TrialState.Done or TrialState.Queued)))
        {
            return null;
        }

        var best = trials.Where(t => t.State == TrialState.Done && !t.AllFolds && t.Score is not null)
            .OrderByDescending(t => t.Folds).ThenBy(t => t.Score).ThenBy(t => t.Id).FirstOrDefault();
        return best is null ? null : For(best.Family, trials, folds, schedule, fullBudget(best.Family));
    }

    /// <summary>The queued trials that run although the hours are spent: the promotion <see cref="AfterHours"/> made.</summary>
    public static IEnumerable<int> AfterHours(SearchDefinition definition, IEnumerable<int> queued, IReadOnlyDictionary<int, TrialRecord> trials) =>
        !definition.Schedule.ByFolds || trials.Values.Any(t => t.AllFolds && t.State == TrialState.Done)
            ? []
            : queued.Where(q => trials[q] is { AllFolds: true, ParentId: not null });
}
