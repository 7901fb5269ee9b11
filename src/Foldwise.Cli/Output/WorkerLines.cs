using Foldwise.Core.Events;

namespace Foldwise.Cli.Output;

/// <summary>
/// A worker's screen: one plain line per event it sees (joining, families it cannot offer, each trial a slot finishes,
/// a search finishing, a refusal, losing the cluster).
/// </summary>
public sealed class WorkerLines(TextWriter output) : IProgress<SearchEvent>
{
    // A worker's screen is a plain log: a fetch's progress is shown at most every StepThrottle.Interval.
    private readonly StepThrottle steps = new();
    private readonly AdvanceLineThrottle advances = new();

    public void Report(SearchEvent value)
    {
        string? line = value switch
        {
            StepProgress p when steps.Due(p) => StepLine.Describe(p),
            SlotTrialAdvanced a when advances.Due(a) => $"Slot {a.Slot}: trial {a.TrialId}: {a.Stage} after {a.Elapsed.TotalSeconds:F0} s",
            SlotFoldFitted f when f.IsLong => $"Slot {f.Slot}: trial {f.TrialId} fold {f.Fold + 1} of {f.Folds} fitted after {f.Elapsed.TotalSeconds:F0} s",
            WorkerStarting s => $"Worker {s.Name} joining {s.Join} from {s.Advertise}" + (s.MutualTls ? " (mutual TLS)" : " (no certificate)") + "; Ctrl-C to leave",
            WorkerJoined j => $"Joined the cluster at {j.Join} as {j.Name} with {j.Slots} slot(s), {j.Threads} thread(s) each",
            WorkerAwaitsCoordinator a => $"Nothing answers at {a.Join} yet (is the coordinator running 'foldwise run --port'?); looking again every {a.RetryIn.TotalSeconds:F0} s",
            WorkerJoinFailed f => $"Cannot join {f.Join} (attempt {f.Attempt}): {f.Reason}; retrying in {f.RetryIn.TotalSeconds:F0} s",
            WorkerLostCluster l => $"Lost the cluster ({l.Reason}); joining again",
            WorkerStopped => "Worker stopped",
            FamilyNotOffered n => $"{n.Family} cannot train on this machine and is not offered: {n.Problem}",
            WorkerRefused r => $"Cannot work for {r.Join}: {r.Reason}",
            WorkerOnSearch w => $"Working on search {w.SearchId}",
            WorkerSearchFinished f => f.Leaving
                ? $"Search {f.SearchId} finished; leaving as asked"
                : $"Search {f.SearchId} finished; waiting for the next search (Ctrl-C to leave)",
            WorkerCoordinatorGone g => $"The coordinator of search {g.FinishedSearchId} has stopped; waiting for it to run the next search",
            WorkerAwaitsNextSearch => "Rejoining to wait for the coordinator's next search",
            SlotQuarantined q => $"Slot {q.Slot}: quarantined by search {q.SearchId}: {q.Reason}",
            SlotTrialScored s => $"Slot {s.Slot}: trial {s.TrialId} attempt {s.Attempt} scored {s.Score:F5} in {s.Took.TotalSeconds:F1} s (accepted: {s.Accepted})",
            SlotLeaseLost l => $"Slot {l.Slot}: lost the lease of trial {l.TrialId} attempt {l.Attempt}; dropping it",
            SlotTrialFailed f => $"Slot {f.Slot}: trial {f.TrialId} failed: {f.Reason}",
            SlotCoordinatorUnreachable u => $"Slot {u.Slot}: coordinator unreachable ({u.Reason}); retrying",
            _ => null,
        };
        if (line is not null)
        {
            // Slots report from their own threads: one whole line at a time.
            lock (output)
            {
                output.WriteLine(line);
            }
        }
    }
}
