using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Search;

namespace Foldwise.Cluster.Coordination;

/// <summary>
/// One running search on the coordinator: Core's <see cref="SearchCoordinator"/> plus the store it records into.
/// It lives outside any grain, so a grain that is deactivated and activated again loses nothing. A failed write to the
/// store (a full disk) stops the search at once: what was committed before stays, and <c>resume</c> continues.
/// </summary>
public sealed class CoordinatorSession
{
    private readonly ISearchRecorder recorder;
    private readonly TaskCompletionSource finished = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly object gate = new();
    private readonly SearchSpan span;

    public CoordinatorSession(SearchManifest manifest, SearchCoordinator coordinator, ISearchRecorder recorder)
    {
        Manifest = manifest;
        Coordinator = coordinator;
        this.recorder = recorder;
        span = new SearchSpan(manifest.SearchId, coordinator.Definition.Name);
        FoldwiseMetrics.Track(this);
    }

    public string SearchId => Manifest.SearchId;

    public SearchManifest Manifest { get; }

    public SearchCoordinator Coordinator { get; }

    /// <summary>Completes once the search has stopped creating trials and none is running.</summary>
    public Task Finished => finished.Task;

    /// <summary>Why the search stopped on a failed store write (e.g. "IOException: No space left on device"); null while the store takes every write.</summary>
    public string? StoreFault { get; private set; }

    /// <summary>Raised after a trial's result is committed (for progress lines).</summary>
    public event Action<TrialRecord>? TrialFinished;

    public LeaseReply Lease(string worker, string slot, IReadOnlyCollection<string>? families = null)
    {
        if (StoreFault is not null || !Writing(() => Coordinator.Lease(worker, slot, families), out var grant))
        {
            return LeaseReply.Done;
        }

        CheckFinished();
        return grant.Kind switch
        {
            LeaseKind.Granted => new LeaseReply(
                LeaseStatus.Granted,
                grant.Trial!.Id,
                grant.Trial.Attempt,
                grant.Trial.Family,
                grant.Run!.Values.ToDictionary(),
                grant.Trial.Budget,
                grant.Seed,
                grant.Trial.LeaseExpires!.Value - grant.Trial.Started!.Value),
            LeaseKind.Wait => LeaseReply.Waiting,
            LeaseKind.Quarantined => LeaseReply.Waiting with { Status = LeaseStatus.Quarantined, Reason = grant.Reason },
            _ => LeaseReply.Done,
        };
    }

    public bool Renew(int trialId, int attempt) => Coordinator.Renew(trialId, attempt);

    /// <summary>Vectors first, then the record: a trial marked done always has its predictions in the store.</summary>
    public bool Report(TrialReport report)
    {
        lock (gate)
        {
            if (!Coordinator.Holds(report.TrialId, report.Attempt))
            {
                return false;
            }

            if (StoreFault is not null ||
                !Writing(() => { recorder.SaveVectors(report.TrialId, report.OutOfFold, report.Test); return true; }, out _) ||
                !Writing(() => Coordinator.Complete(report.TrialId, report.Attempt, report.Score, [.. report.FoldScores]), out bool accepted))
            {
                return false;
            }

            if (accepted)
            {
                TrialFinished?.Invoke(Coordinator.Trial(report.TrialId)!);
            }

            CheckFinished();
            return accepted;
        }
    }

    public bool Release(int trialId, int attempt, string reason, bool interrupted)
    {
        if (StoreFault is not null || !Writing(() => Coordinator.Release(trialId, attempt, reason, interrupted), out bool released))
        {
            return false;
        }

        CheckFinished();
        return released;
    }

    public ProgressReply Progress()
    {
        var p = Coordinator.Progress();
        var runningOn = Coordinator.Trials()
            .Where(t => t.State == TrialState.Running)
            .Select(t => $"{t.Worker}/{t.Slot}")
            .ToArray();
        return new ProgressReply(
            p.Created, p.Queued, p.Running, p.Done, p.Failed, p.TrialBudget, p.SpentSeconds, p.HoursBudget,
            p.BestByFamily.ToDictionary(), p.Stopping?.ToString(), p.Finished, runningOn, p.Quarantined?.ToDictionary());
    }

    /// <summary>Called about once a second: expires lost leases and records the time spent.</summary>
    public void Tick()
    {
        if (StoreFault is not null)
        {
            return;
        }

        Writing(() =>
        {
            Coordinator.ExpireLeases();
            recorder.UpdateSpent(Coordinator.Progress().SpentSeconds, finished: false);
            return true;
        }, out _);
        CheckFinished();
    }

    /// <summary>Runs one write to the store; on failure records the fault, ends the search, and returns false.</summary>
    private bool Writing<T>(Func<T> write, out T result)
    {
        try
        {
            result = write();
            return true;
        }
#pragma warning disable CA1031 // Whatever the store threw, the search must stop rather than run on with results it cannot keep.
        catch (Exception e)
#pragma warning restore CA1031
        {
            result = default!;
            StoreFault ??= $"{e.GetType().Name}: {e.Message.Split('\n')[0].Trim()}";
            span.End(Coordinator.Progress());
            finished.TrySetResult();
            return false;
        }
    }

    private void CheckFinished()
    {
        var progress = Coordinator.Progress();
        if (progress.Finished)
        {
            span.End(progress);
            finished.TrySetResult();
        }
    }
}
