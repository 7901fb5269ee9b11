namespace Foldwise.Cluster.Contracts;

/// <summary>
/// The coordinator of one search, keyed by search id. Slots pull work from it; it hands every decision to
/// Core's <c>SearchCoordinator</c>, and commits to the store before it answers.
/// </summary>
[Alias("Foldwise.ISearchGrain")]
public interface ISearchGrain : IGrainWithStringKey
{
    Task<SearchManifest> GetManifestAsync();

    /// <summary>The next trial of one of <paramref name="families"/> (the families this worker trains), or why there is none.</summary>
    Task<LeaseReply> LeaseAsync(string worker, string slot, string[] families);

    /// <summary>False when the lease is no longer the caller's: the slot should drop the trial.</summary>
    Task<bool> RenewAsync(int trialId, int attempt);

    /// <summary>False for a late report of a lost lease (ignored).</summary>
    Task<bool> ReportAsync(TrialReport report);

    Task<bool> ReleaseAsync(int trialId, int attempt, string reason, bool interrupted);

    Task<ProgressReply> GetProgressAsync();
}
