namespace Foldwise.Core.Search;

/// <summary>
/// Whether a trial about to start is expected to end within the hours budget. Its expected seconds are its budget ×
/// folds at its family's median seconds per budget unit and fold among the search's done trials of the same budget and
/// folds (else of any budget; rounds taken over from a screen are not counted as trained). A trial of a family with no
/// done trial yet is expected to fit. <see cref="HoursParking"/> acts on the answer.
/// </summary>
public static class HoursFit
{
    /// <param name="spentSeconds">Wall-clock seconds the search has spent, earlier sessions included.</param>
    /// <param name="folds">The search's fold count (a trial on every fold trains this many).</param>
    public static bool Fits(TrialRecord next, double spentSeconds, double? hours, IEnumerable<TrialRecord> trials, int folds)
    {
        ArgumentNullException.ThrowIfNull(next);
        if (hours is not { } budget)
        {
            return true;
        }

        var done = trials.Where(t => t.Family == next.Family && t.State == TrialState.Done && t.Duration is not null).ToList();
        var alike = done.Where(t => t.Budget == next.Budget && t.Folds == next.Folds).ToList();
        var basis = alike.Count > 0 ? alike : done;
        if (basis.Count == 0)
        {
            return true;
        }

        var rates = basis.Select(t => t.Duration!.Value.TotalSeconds / Units(t, folds)).Order().ToList();
        double median = rates.Count % 2 == 1 ? rates[rates.Count / 2] : (rates[(rates.Count / 2) - 1] + rates[rates.Count / 2]) / 2;
        return spentSeconds + (median * Units(next, folds)) <= budget * 3600;
    }

    /// <summary>Budget units × folds the trial trains.</summary>
    private static double Units(TrialRecord trial, int folds) =>
        Math.Max(1.0, ((double)trial.Budget * (trial.AllFolds ? folds : trial.Folds)) - trial.RoundsContinued);
}
