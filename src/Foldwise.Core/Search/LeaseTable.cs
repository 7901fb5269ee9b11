namespace Foldwise.Core.Search;

/// <summary>
/// The live leases of running trials: one per trial, or more while backup copies run. Knows nothing of trial
/// records; <see cref="SearchCoordinator"/> keeps the two in step under its own lock (this class is not thread-safe).
/// </summary>
internal sealed class LeaseTable
{
    private readonly Dictionary<int, List<LeaseHold>> holds = [];

    public IReadOnlyList<LeaseHold> Of(int trialId) => holds[trialId];

    /// <summary>A trial's first lease (it was queued).</summary>
    public void Start(int trialId, LeaseHold hold) => holds[trialId] = [hold];

    /// <summary>A backup copy's lease beside the ones running.</summary>
    public void Add(int trialId, LeaseHold hold) => holds[trialId].Add(hold);

    public LeaseHold? Find(int trialId, int attempt) =>
        holds.TryGetValue(trialId, out var live) ? live.Find(h => h.Attempt == attempt) : null;

    /// <summary>Extends one lease; returns when the trial's last lease now expires.</summary>
    public DateTimeOffset Renew(int trialId, LeaseHold hold, DateTimeOffset expires)
    {
        var live = holds[trialId];
        live[live.IndexOf(hold)] = hold with { Expires = expires };
        return live.Max(h => h.Expires);
    }

    /// <summary>Ends one lease; returns the leases still running the trial (none: the trial lost its last copy).</summary>
    public IReadOnlyList<LeaseHold> Drop(int trialId, LeaseHold hold)
    {
        var live = holds[trialId];
        live.Remove(hold);
        return live;
    }

    /// <summary>The trial no longer runs (done, queued again or failed).</summary>
    public void Forget(int trialId) => holds.Remove(trialId);

    public List<(int TrialId, LeaseHold Hold)> Expired(DateTimeOffset now) =>
        [.. holds.SelectMany(kv => kv.Value.Where(h => h.Expires < now).Select(h => (kv.Key, h)))];
}
