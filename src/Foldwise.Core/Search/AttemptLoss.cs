namespace Foldwise.Core.Search;

/// <summary>
/// What a trial becomes when an attempt ends without a result: queued again with the loss on record, or failed
/// for good once <paramref name="maxAttempts"/> counted losses are reached. An interruption does not count.
/// </summary>
internal static class AttemptLoss
{
    public static TrialRecord Apply(TrialRecord trial, string reason, bool counts, int maxAttempts, DateTimeOffset now, int? attempt = null)
    {
        int failures = trial.Failures + (counts ? 1 : 0);
        bool failed = failures >= maxAttempts;
        return trial with
        {
            State = failed ? TrialState.Failed : TrialState.Queued,
            Failures = failures,
            LostAttempts = trial.LostAttempts.Add($"attempt {attempt ?? trial.Attempt}: {reason}"),
            FailureReason = failed ? $"gave up after {failures} lost attempts; last: {reason}" : null,
            Finished = failed ? now : null,
            LeaseExpires = null,
            Worker = failed ? trial.Worker : null,
            Slot = failed ? trial.Slot : null,
        };
    }

    /// <summary>One copy of a backed-up trial lost its lease; the trial carries on where <paramref name="other"/> runs, nothing counted.</summary>
    public static TrialRecord CarriedOn(TrialRecord trial, int lostAttempt, string reason, LeaseHold other) => trial with
    {
        Worker = other.Worker,
        Slot = other.Slot,
        Started = other.Started,
        LeaseExpires = other.Expires,
        LostAttempts = trial.LostAttempts.Add($"attempt {lostAttempt}: {reason} (attempt {other.Attempt} carries on)"),
    };
}
