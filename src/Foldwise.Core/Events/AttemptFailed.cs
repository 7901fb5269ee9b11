namespace Foldwise.Core.Events;

/// <summary>
/// An attempt at a trial failed on <paramref name="Machine"/> (worker/slot) and its lease was given back with
/// <paramref name="Reason"/>; the trial is queued again (when it fails for good, <see cref="TrialFailed"/> says so instead).
/// </summary>
public sealed record AttemptFailed(string SearchId, int TrialId, int Attempt, string Machine, string Reason) : SearchEvent;
