using System.Collections.Immutable;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Search;

/// <summary>
/// The search's state machine: the queue, the leases, and when to stop. It asks the schedule what to
/// create, commits every change to the journal before returning (the store is the only truth), and
/// ignores late reports from lost leases. Thread-safe; the grain in front of it only forwards calls.
/// </summary>
public sealed class SearchCoordinator
{
    private readonly object gate = new();
    private readonly SearchDefinition definition;
    private readonly ISchedule schedule;
    private readonly ITrialJournal journal;
    private readonly TimeProvider time;
    private readonly CoordinatorOptions options;
    private readonly Dictionary<int, TrialRecord> trials = [];
    private readonly SortedSet<int> queued = [];
    private readonly Dictionary<int, TrialRecord> running = [];
    private readonly double spentBefore;
    private readonly DateTimeOffset sessionStart;
    private int nextId = 1;
    private bool stopRequested;
    private StopReason? stopping;

    /// <param name="history">Trials from the store when resuming, in any order; running ones are queued again.</param>
    /// <param name="spentSeconds">Wall-clock seconds earlier sessions of this search spent.</param>
    public SearchCoordinator(
        SearchDefinition definition,
        ISchedule schedule,
        ITrialJournal journal,
        TimeProvider time,
        CoordinatorOptions? options = null,
        IEnumerable<TrialRecord>? history = null,
        double spentSeconds = 0)
    {
        this.definition = definition;
        this.schedule = schedule;
        this.journal = journal;
        this.time = time;
        this.options = options ?? new CoordinatorOptions();
        this.options.Validate();
        spentBefore = spentSeconds;
        sessionStart = time.GetUtcNow();
        foreach (var trial in (history ?? []).OrderBy(t => t.Id))
        {
            Replay(trial);
        }
    }

    public SearchDefinition Definition => definition;

    /// <summary>Gives a slot the next trial: a queued one first (lowest id), else a new one from the schedule.</summary>
    public LeaseGrant Lease(string worker, string slot)
    {
        lock (gate)
        {
            var now = time.GetUtcNow();
            ExpireLeasesLocked(now);
            UpdateStoppingLocked(now);
            int? id = queued.Count > 0 && stopping is not (StopReason.Requested or StopReason.HoursBudget) ? queued.Min : CreateLocked(now);
            if (id is not { } trialId)
            {
                return IsFinishedLocked() ? LeaseGrant.Finished : LeaseGrant.Wait;
            }

            queued.Remove(trialId);
            var leased = trials[trialId] with
            {
                State = TrialState.Running,
                Attempt = trials[trialId].Attempt + 1,
                Worker = worker,
                Slot = slot,
                Started = now,
                LeaseExpires = now + options.LeaseDuration,
            };
            CommitLocked(leased);
            return new LeaseGrant(LeaseKind.Granted, leased, SeedOf(leased));
        }
    }

    /// <summary>Extends a running slot's lease; false when the lease is no longer its own (the slot should abandon the trial).</summary>
    public bool Renew(int trialId, int attempt)
    {
        lock (gate)
        {
            if (!running.TryGetValue(trialId, out var trial) || trial.Attempt != attempt)
            {
                return false;
            }

            running[trialId] = trials[trialId] = trial with { LeaseExpires = time.GetUtcNow() + options.LeaseDuration };
            return true;
        }
    }

    /// <summary>
    /// Records a finished trial. The caller stores its prediction vectors first, so a done trial always has them.
    /// Returns false for a report from a lost lease (another attempt owns the trial, or it finished already).
    /// </summary>
    public bool Complete(int trialId, int attempt, double score, ImmutableArray<double> foldScores)
    {
        lock (gate)
        {
            if (!IsCurrentLocked(trialId, attempt))
            {
                return false;
            }

            CommitLocked(trials[trialId] with
            {
                State = TrialState.Done,
                Score = score,
                FoldScores = foldScores,
                Finished = time.GetUtcNow(),
                LeaseExpires = null,
            });
            return true;
        }
    }

    /// <summary>
    /// Takes a trial back from a slot without a result. An interruption (the slot is stopping) queues it again
    /// for free; an error counts against <see cref="CoordinatorOptions.MaxAttempts"/>.
    /// </summary>
    public bool Release(int trialId, int attempt, string reason, bool interrupted)
    {
        lock (gate)
        {
            if (!IsCurrentLocked(trialId, attempt))
            {
                return false;
            }

            CommitLocked(LoseAttempt(trials[trialId], reason, counts: !interrupted));
            return true;
        }
    }

    /// <summary>Whether this attempt still holds its trial's lease (checked before a report's vectors are stored).</summary>
    public bool Holds(int trialId, int attempt)
    {
        lock (gate)
        {
            return IsCurrentLocked(trialId, attempt);
        }
    }

    /// <summary>Returns trials whose lease ran out to the queue (or fails them at the attempt limit).</summary>
    public void ExpireLeases()
    {
        lock (gate)
        {
            ExpireLeasesLocked(time.GetUtcNow());
        }
    }

    /// <summary>No new trials start; running ones may finish (Ctrl-C).</summary>
    public void RequestStop()
    {
        lock (gate)
        {
            stopRequested = true;
            stopping = StopReason.Requested;
        }
    }

    public SearchProgress Progress()
    {
        lock (gate)
        {
            var now = time.GetUtcNow();
            UpdateStoppingLocked(now);
            var best = trials.Values
                .Where(t => t.State == TrialState.Done && t.Score is not null)
                .GroupBy(t => t.Family)
                .ToImmutableSortedDictionary(g => g.Key, g => g.Min(t => t.Score!.Value));
            return new SearchProgress(
                trials.Count,
                queued.Count,
                running.Count,
                trials.Values.Count(t => t.State == TrialState.Done),
                trials.Values.Count(t => t.State == TrialState.Failed),
                definition.Budget.Trials,
                SpentSecondsLocked(now),
                definition.Budget.Hours,
                best,
                stopping,
                IsFinishedLocked());
        }
    }

    public TrialRecord? Trial(int id)
    {
        lock (gate)
        {
            return trials.GetValueOrDefault(id);
        }
    }

    public IReadOnlyList<TrialRecord> Trials()
    {
        lock (gate)
        {
            return [.. trials.Values.OrderBy(t => t.Id)];
        }
    }

    private int? CreateLocked(DateTimeOffset now)
    {
        if (stopping is not null)
        {
            return null;
        }

        var plan = schedule.NextPlan();
        if (plan is null)
        {
            if (running.Count == 0 && queued.Count == 0)
            {
                // Nothing runs that could unblock the schedule: it has nothing more to give.
                stopping = StopReason.ScheduleExhausted;
            }

            return null;
        }

        var created = new TrialRecord
        {
            Id = nextId++,
            Family = plan.Family,
            Parameters = plan.Parameters,
            Budget = plan.Budget,
            Rung = plan.Rung,
            ParentId = plan.ParentId,
            Proposer = plan.Proposer,
            Bracket = plan.Bracket,
            Created = now,
        };
        CommitLocked(created);
        return created.Id;
    }

    private void UpdateStoppingLocked(DateTimeOffset now)
    {
        if (stopping is not null)
        {
            return;
        }

        if (stopRequested)
        {
            stopping = StopReason.Requested;
        }
        else if (definition.Budget.Hours is { } hours && SpentSecondsLocked(now) >= hours * 3600)
        {
            stopping = StopReason.HoursBudget;
        }
        else if (definition.Budget.Trials is { } budget && trials.Count >= budget)
        {
            stopping = StopReason.TrialBudget;
        }
        else if (schedule.Exhausted)
        {
            stopping = StopReason.ScheduleExhausted;
        }
    }

    private bool IsFinishedLocked() =>
        stopping is not null && running.Count == 0 &&
        (queued.Count == 0 || stopping is StopReason.Requested or StopReason.HoursBudget);

    private void ExpireLeasesLocked(DateTimeOffset now)
    {
        foreach (var trial in running.Values.Where(t => t.LeaseExpires < now).ToList())
        {
            CommitLocked(LoseAttempt(trial, $"lease expired on {trial.Worker}/{trial.Slot}", counts: true));
        }
    }

    private TrialRecord LoseAttempt(TrialRecord trial, string reason, bool counts)
    {
        int failures = trial.Failures + (counts ? 1 : 0);
        bool failed = failures >= options.MaxAttempts;
        return trial with
        {
            State = failed ? TrialState.Failed : TrialState.Queued,
            Failures = failures,
            LostAttempts = trial.LostAttempts.Add($"attempt {trial.Attempt}: {reason}"),
            FailureReason = failed ? $"gave up after {failures} lost attempts; last: {reason}" : null,
            Finished = failed ? time.GetUtcNow() : null,
            LeaseExpires = null,
            Worker = failed ? trial.Worker : null,
            Slot = failed ? trial.Slot : null,
        };
    }

    private bool IsCurrentLocked(int trialId, int attempt) =>
        running.TryGetValue(trialId, out var trial) && trial.Attempt == attempt;

    /// <summary>Journal first, then memory: a record the journal refused never becomes the coordinator's truth.</summary>
    private void CommitLocked(TrialRecord trial)
    {
        journal.Save(trial);
        ApplyLocked(trial);
        schedule.Observe(trial);
    }

    private void ApplyLocked(TrialRecord trial)
    {
        trials[trial.Id] = trial;
        nextId = Math.Max(nextId, trial.Id + 1);
        queued.Remove(trial.Id);
        running.Remove(trial.Id);
        switch (trial.State)
        {
            case TrialState.Queued:
                queued.Add(trial.Id);
                break;
            case TrialState.Running:
                running[trial.Id] = trial;
                break;
        }
    }

    private void Replay(TrialRecord trial)
    {
        // The schedule sees each stored trial as created, then in its last state, as it would have live.
        var asCreated = trial with { State = TrialState.Queued, Score = null, FoldScores = [], Finished = null };
        ApplyLocked(asCreated);
        schedule.Observe(asCreated);
        if (trial.State == TrialState.Running)
        {
            CommitLocked(LoseAttempt(trial, "interrupted: the coordinator stopped", counts: false));
        }
        else if (trial.State != TrialState.Queued)
        {
            ApplyLocked(trial);
            schedule.Observe(trial);
        }
    }

    /// <summary>Promotions share their first candidate's seed, so a longer fit grows the same trees.</summary>
    private int SeedOf(TrialRecord trial)
    {
        var root = trial;
        while (root.ParentId is { } parent && trials.TryGetValue(parent, out var up))
        {
            root = up;
        }

        return unchecked((definition.Seed * 100_003) + (root.Id * 7919));
    }

    private double SpentSecondsLocked(DateTimeOffset now) => spentBefore + (now - sessionStart).TotalSeconds;
}
