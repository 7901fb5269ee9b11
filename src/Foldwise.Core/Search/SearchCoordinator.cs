using System.Collections.Immutable;
using Foldwise.Core.Blending;
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
    private readonly HashSet<string> familiesAtFullBudget = new(StringComparer.Ordinal);

    private readonly LeaseTable leases = new();
    private readonly WorkerQuarantine quarantine;
    private readonly StragglerWatch? stragglers;
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
        quarantine = new WorkerQuarantine(this.options.QuarantineAfter);
        stragglers = this.options.BackupAfter is { } factor ? new StragglerWatch(factor, this.options.BackupMinimumDone) : null;
        spentBefore = spentSeconds;
        sessionStart = time.GetUtcNow();
        foreach (var trial in (history ?? []).OrderBy(t => t.Id))
        {
            Replay(trial);
        }
    }

    public SearchDefinition Definition => definition;

    /// <summary>
    /// Gives a slot the next trial of a family its worker offers: a queued one first (lowest id), else a new one from
    /// the schedule. A new trial of a family the worker does not offer is queued for another worker, and while such a
    /// trial waits, this worker creates no more (so a machine without a family cannot flood the queue).
    /// </summary>
    /// <param name="families">The families the asking worker trains; null for every family.</param>
    public LeaseGrant Lease(string worker, string slot, IReadOnlyCollection<string>? families = null)
    {
        lock (gate)
        {
            var now = time.GetUtcNow();
            ExpireLeasesLocked(now);
            UpdateStoppingLocked(now);
            if (quarantine.Reason(worker) is { } why)
            {
                return IsFinishedLocked() ? LeaseGrant.Finished : new LeaseGrant(LeaseKind.Quarantined, Reason: why);
            }

            bool takesQueued = stopping is not (StopReason.Requested or StopReason.HoursBudget);
            var runnable = takesQueued ? queued : stopping is StopReason.HoursBudget ? ScreenFinish.AfterHours(definition, queued, trials) : [];
            int? id = runnable.Where(q => Offers(families, trials[q].Family)).Select(q => (int?)q).FirstOrDefault();
            if (id is null && !(takesQueued && queued.Count > 0) && CreateLocked(now) is { } created && Offers(families, trials[created].Family))
            {
                id = created;
            }

            if (id is not { } trialId)
            {
                return BackupLocked(worker, slot, now, families) ?? (IsFinishedLocked() ? LeaseGrant.Finished : LeaseGrant.Wait);
            }

            queued.Remove(trialId);
            var hold = new LeaseHold(trials[trialId].Attempt + 1, worker, slot, now, now + options.LeaseDuration);
            var leased = trials[trialId] with
            {
                State = TrialState.Running,
                Attempt = hold.Attempt,
                Worker = worker,
                Slot = slot,
                Started = now,
                LeaseExpires = hold.Expires,
            };
            CommitLocked(leased);
            leases.Start(trialId, hold);
            return Granted(leased);
        }
    }

    /// <summary>Extends a running slot's lease; false when the lease is no longer its own (the slot should abandon the trial).</summary>
    public bool Renew(int trialId, int attempt)
    {
        lock (gate)
        {
            if (HoldLocked(trialId, attempt) is not { } hold)
            {
                return false;
            }

            var lastExpiry = leases.Renew(trialId, hold, time.GetUtcNow() + options.LeaseDuration);
            running[trialId] = trials[trialId] = running[trialId] with { LeaseExpires = lastExpiry };
            return true;
        }
    }

    /// <summary>
    /// Records a finished trial. The caller stores its prediction vectors first, so a done trial always has them.
    /// Returns false for a report from a lost lease (another attempt owns the trial, or it finished already).
    /// <paramref name="bestRound"/> and <paramref name="roundsContinued"/> are stored as the record's properties of those names.
    /// </summary>
    public bool Complete(int trialId, int attempt, double score, ImmutableArray<double> foldScores, int? bestRound = null, int roundsContinued = 0)
    {
        lock (gate)
        {
            if (HoldLocked(trialId, attempt) is not { } winner)
            {
                return false;
            }

            var done = trials[trialId] with
            {
                State = TrialState.Done,
                Score = score,
                FoldScores = foldScores,
                BestRound = bestRound,
                RoundsContinued = roundsContinued,
                Worker = winner.Worker,
                Slot = winner.Slot,
                Started = winner.Started,
                Finished = time.GetUtcNow(),
                LeaseExpires = null,
            };
            CommitLocked(done);
            quarantine.Succeeded(winner.Worker);
            stragglers?.Finished(done.Budget, done.Duration!.Value);
            UpdateStoppingLocked(done.Finished!.Value);
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
            if (HoldLocked(trialId, attempt) is not { } hold)
            {
                return false;
            }

            DropHoldLocked(trialId, hold, $"{reason} on {hold.Worker}/{hold.Slot}", counts: !interrupted);
            if (!interrupted)
            {
                quarantine.Failed(hold.Worker, reason);
            }

            return true;
        }
    }

    /// <summary>Whether this attempt still holds its trial's lease (checked before a report's vectors are stored).</summary>
    public bool Holds(int trialId, int attempt)
    {
        lock (gate)
        {
            return HoldLocked(trialId, attempt) is not null;
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
            return new SearchProgress(
                trials.Count,
                queued.Count,
                running.Count,
                trials.Values.Count(t => t.State == TrialState.Done),
                trials.Values.Count(t => t.State == TrialState.Failed),
                definition.Budget.Trials,
                SpentSecondsLocked(now),
                definition.Budget.Hours,
                SearchProgress.BestOf(trials.Values),
                stopping,
                IsFinishedLocked(),
                quarantine.All());
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

        var created = plan.ToTrial(nextId++, now);
        CommitLocked(created);
        return created.Id;
    }

    /// <summary>Decides whether the search stops, and queues what <see cref="ScreenFinish"/> asks of one that stopped while screening on folds.</summary>
    private void UpdateStoppingLocked(DateTimeOffset now)
    {
        stopping ??= StopRules.Reason(stopRequested, definition.Budget, SpentSecondsLocked(now), trials.Count, schedule.Exhausted);
        foreach (var plan in ScreenFinish.Needed(definition, stopping, trials.Values))
        {
            CommitLocked(plan.ToTrial(nextId++, now));
        }
    }

    private bool IsFinishedLocked() =>
        StopRules.Finished(stopping, running.Count, queued.Count) && !(stopping is StopReason.HoursBudget && ScreenFinish.AfterHours(definition, queued, trials).Any());

    private void ExpireLeasesLocked(DateTimeOffset now)
    {
        foreach (var (trialId, hold) in leases.Expired(now))
        {
            DropHoldLocked(trialId, hold, $"lease expired on {hold.Worker}/{hold.Slot}", counts: true);
        }
    }

    /// <summary>
    /// Ends one lease of a running trial without a result. With a backup copy still running the trial carries
    /// on there (nothing counted against it); otherwise it goes back to the queue, or fails at the attempt limit.
    /// </summary>
    private void DropHoldLocked(int trialId, LeaseHold hold, string reason, bool counts)
    {
        var live = leases.Drop(trialId, hold);
        var trial = trials[trialId];
        if (live.Count == 0)
        {
            CommitLocked(LoseAttempt(trial, reason, counts, hold.Attempt));
            return;
        }

        CommitLocked(AttemptLoss.CarriedOn(trial, hold.Attempt, reason, live[0]));
    }

    /// <summary>An idle slot's backup copy of the most overdue trial, when the straggler watch names one.</summary>
    private LeaseGrant? BackupLocked(string worker, string slot, DateTimeOffset now, IReadOnlyCollection<string>? families)
    {
        if (stragglers is null || stopping is StopReason.Requested or StopReason.HoursBudget ||
            stragglers.Pick(running.Values.Where(t => Offers(families, t.Family)).Select(t => (t.Id, t.Budget, leases.Of(t.Id))), worker, now,
                draining: stopping is StopReason.TrialBudget or StopReason.ScheduleExhausted) is not { } trialId)
        {
            return null;
        }

        var trial = trials[trialId];
        var hold = new LeaseHold(trial.Attempt + 1, worker, slot, now, now + options.LeaseDuration);
        // The record keeps the first copy's place (history shows where it ran) and the highest attempt issued,
        // so attempt numbers are never reused.
        var backedUp = trial with { Attempt = hold.Attempt, LeaseExpires = new[] { trial.LeaseExpires ?? now, hold.Expires }.Max() };
        CommitLocked(backedUp);
        leases.Add(trialId, hold);
        return Granted(backedUp with { Worker = worker, Slot = slot, Started = now });
    }

    private static bool Offers(IReadOnlyCollection<string>? families, string family) => families is null || families.Contains(family);

    private LeaseHold? HoldLocked(int trialId, int attempt) =>
        running.ContainsKey(trialId) ? leases.Find(trialId, attempt) : null;

    private TrialRecord LoseAttempt(TrialRecord trial, string reason, bool counts, int? attempt = null) =>
        AttemptLoss.Apply(trial, reason, counts, options.MaxAttempts, time.GetUtcNow(), attempt);

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
        if (trial.State == TrialState.Done && trial.AllFolds && trial.Budget >= definition.BudgetOf(trial.Family).FullBudget)
        {
            familiesAtFullBudget.Add(trial.Family);
        }

        nextId = Math.Max(nextId, trial.Id + 1);
        queued.Remove(trial.Id);
        running.Remove(trial.Id);
        if (trial.State != TrialState.Running)
        {
            leases.Forget(trial.Id);
        }

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

    private LeaseGrant Granted(TrialRecord trial)
    {
        var fit = TrialFit.For(trial, trials, definition);
        return new(LeaseKind.Granted, trial, fit.Seed, fit.Run, PredictsTest: TestPredictions.Wanted(trial.Budget, definition.BudgetOf(trial.Family).FullBudget, familiesAtFullBudget.Contains(trial.Family), trial.AllFolds));
    }

    private double SpentSecondsLocked(DateTimeOffset now) => spentBefore + (now - sessionStart).TotalSeconds;
}
