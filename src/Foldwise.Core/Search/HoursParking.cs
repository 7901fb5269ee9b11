using Foldwise.Core.Definition;

namespace Foldwise.Core.Search;

/// <summary>
/// Trials held back because they would end after the hours budget (<see cref="HoursFit"/>). Each stays queued for a
/// resume while the slot that drew it takes the schedule's next trial, so the time left goes to trials that fit it (a
/// LightGBM screen of seconds rather than a FastTree promotion of many minutes). Once more than two trials per family
/// are held back, the time left fits too little and the search stops as at its hours (<c>HoursParkingTests</c>).
/// </summary>
internal sealed class HoursParking(SearchDefinition definition)
{
    private readonly HashSet<int> held = [];

    public bool Holds(int trialId) => held.Contains(trialId);

    /// <summary>True once so many trials are held back that the search should stop.</summary>
    public bool Full => held.Count > 2 * definition.Families.Length;

    /// <summary>Holds <paramref name="next"/> back, and says so, when it would end after the hours budget.</summary>
    public bool Parks(TrialRecord next, double spentSeconds, IEnumerable<TrialRecord> trials)
    {
        if (HoursFit.Fits(next, spentSeconds, definition.Budget.Hours, trials, definition.Folds))
        {
            return false;
        }

        held.Add(next.Id);
        return true;
    }
}
