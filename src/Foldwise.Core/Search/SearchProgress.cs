using System.Collections.Immutable;

namespace Foldwise.Core.Search;

/// <summary>
/// A snapshot for progress bars and <c>status</c>: counts by state, the best score so far per family, budgets spent,
/// and the workers quarantined in this session with the reason.
/// </summary>
public sealed record SearchProgress(
    int Created,
    int Queued,
    int Running,
    int Done,
    int Failed,
    int? TrialBudget,
    double SpentSeconds,
    double? HoursBudget,
    ImmutableSortedDictionary<string, double> BestByFamily,
    StopReason? Stopping,
    bool Finished,
    ImmutableSortedDictionary<string, string>? Quarantined = null)
{
    public double? Best => BestByFamily.Count == 0 ? null : BestByFamily.Values.Min();

    /// <summary>The lowest score of each family's done trials on every fold (a screening score on some folds covers other rows).</summary>
    public static ImmutableSortedDictionary<string, double> BestOf(IEnumerable<TrialRecord> trials) =>
        trials.Where(t => t.State == TrialState.Done && t.AllFolds && t.Score is not null)
            .GroupBy(t => t.Family)
            .ToImmutableSortedDictionary(g => g.Key, g => g.Min(t => t.Score!.Value));
}
