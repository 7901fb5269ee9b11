using System.Collections.Immutable;
using System.Diagnostics;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
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
    private readonly IProgress<SearchEvent> events;
    private readonly string? traceParent;

    /// <param name="events">Receives trials started, promoted, scored and failed, on the threads that decide them. Default: none.</param>
    /// <param name="search">The search's span: every lease carries it, so each trial's span, on whichever machine, is its child. Default: none.</param>
    public CoordinatorSession(SearchManifest manifest, SearchCoordinator coordinator, ISearchRecorder recorder, IProgress<SearchEvent>? events = null, ActivityContext search = default)
    {
        Manifest = manifest;
        Coordinator = coordinator;
        this.recorder = recorder;
        this.events = events ?? NoEvents.Instance;
        traceParent = search == default ? null : TraceParent.Of(search);
    }

    public string SearchId => Manifest.SearchId;

    public SearchManifest Manifest { get; }

    public SearchCoordinator Coordinator { get; }

    /// <summary>Completes once the search has stopped creating trials and none is running.</summary>
    public Task Finished => finished.Task;

    /// <summary>Why the search stopped on a failed store write (e.g. "IOException: No space left on device"); null while the store takes every write.</summary>
    public string? StoreFault { get; private set; }

    /// <param name="families">The families this worker offers (null: any); a trial of another family is never leased to it.</param>
    public LeaseReply Lease(string worker, string slot, IReadOnlyCollection<string>? families = null)
    {
        if (StoreFault is not null || !Writing(() => Coordinator.Lease(worker, slot, families), out var grant))
        {
            return LeaseReply.Done;
        }

        if (grant.Kind == LeaseKind.Granted)
        {
            if (grant.Trial!.ParentId is not null && grant.Trial.Attempt == 1)
            {
                events.Report(new CandidatePromoted(SearchId, grant.Trial));
            }

            events.Report(new TrialStarted(SearchId, grant.Trial));
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
                grant.Trial.LeaseExpires!.Value - grant.Trial.Started!.Value,
                traceParent,
                PredictsTest: grant.PredictsTest,
                Folds: grant.Trial.Folds,
                ParentId: grant.Trial.ParentId),
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
                !Writing(() => Coordinator.Complete(report.TrialId, report.Attempt, report.Score, [.. report.FoldScores], report.BestRound, report.RoundsContinued), out bool accepted))
            {
                return false;
            }

            if (accepted)
            {
                events.Report(new TrialScored(SearchId, Coordinator.Trial(report.TrialId)!, Coordinator.Progress()));
            }

            CheckFinished();
            return accepted;
        }
    }

    public bool Release(int trialId, int attempt, string reason, bool interrupted)
    {
        var holder = Coordinator.Trial(trialId);
        var quarantinedBefore = Coordinator.Progress().Quarantined;
        if (StoreFault is not null || !Writing(() => Coordinator.Release(trialId, attempt, reason, interrupted), out bool released))
        {
            return false;
        }

        if (released && !interrupted)
        {
            ReportFailure(trialId, attempt, $"{holder?.Worker}/{holder?.Slot}", reason, quarantinedBefore);
        }

        CheckFinished();
        return released;
    }

    /// <summary>Says what a failed attempt did: the trial queued again or failed for good, and a worker quarantined by it.</summary>
    private void ReportFailure(int trialId, int attempt, string machine, string reason, ImmutableSortedDictionary<string, string>? quarantinedBefore)
    {
        var progress = Coordinator.Progress();
        if (Coordinator.Trial(trialId) is { State: TrialState.Failed } failed)
        {
            events.Report(new TrialFailed(SearchId, failed, progress));
        }
        else
        {
            events.Report(new AttemptFailed(SearchId, trialId, attempt, machine, reason));
        }

        foreach (var (worker, why) in progress.Quarantined ?? ImmutableSortedDictionary<string, string>.Empty)
        {
            if (quarantinedBefore?.ContainsKey(worker) != true)
            {
                events.Report(new WorkerQuarantined(SearchId, worker, why));
            }
        }
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

        int failedBefore = Coordinator.Progress().Failed;
        if (!Writing(() => { Coordinator.ExpireLeases(); return true; }, out _))
        {
            return;
        }

        var progress = Coordinator.Progress();
        if (progress.Failed > failedBefore)
        {
            // A trial whose last allowed attempt expired: the newest failures are the ones this tick caused.
            foreach (var failed in Coordinator.Trials().Where(t => t.State == TrialState.Failed).OrderByDescending(t => t.Finished ?? t.Created).Take(progress.Failed - failedBefore))
            {
                events.Report(new TrialFailed(SearchId, failed, progress));
            }
        }

        if (!Writing(() => { recorder.UpdateSpent(progress.SpentSeconds, finished: false); return true; }, out _))
        {
            return;
        }

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
            finished.TrySetResult();
            return false;
        }
    }

    private void CheckFinished()
    {
        var progress = Coordinator.Progress();
        if (progress.Finished)
        {
            finished.TrySetResult();
        }
    }
}
