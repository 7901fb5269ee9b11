using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Grains;

/// <summary>A thin front for one search's <see cref="CoordinatorSession"/>: it forwards every call, holds no state, decides nothing.</summary>
[GrainType(GrainNames.Search)]
internal sealed class SearchGrain(SessionRegistry sessions) : Grain, ISearchGrain
{
    private CoordinatorSession Session => sessions.Get(this.GetPrimaryKeyString());

    public Task<SearchManifest> GetManifestAsync() => Task.FromResult(Session.Manifest);

    public Task<LeaseReply> LeaseAsync(string worker, string slot, string[] families) => Task.FromResult(Session.Lease(worker, slot, families));

    public Task<bool> RenewAsync(int trialId, int attempt) => Task.FromResult(Session.Renew(trialId, attempt));

    public Task<bool> ReportAsync(TrialReport report) => Task.FromResult(Session.Report(report));

    public Task<bool> ReleaseAsync(int trialId, int attempt, string reason, bool interrupted) =>
        Task.FromResult(Session.Release(trialId, attempt, reason, interrupted));

    public Task<ProgressReply> GetProgressAsync() => Task.FromResult(Session.Progress());
}
