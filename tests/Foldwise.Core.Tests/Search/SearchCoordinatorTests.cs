using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Search;

public sealed class SearchCoordinatorTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 1, 9, 0, 0, TimeSpan.Zero));
    private readonly MemoryJournal journal = new();
    private readonly CountingSchedule schedule = new();

    private static SearchDefinition Definition(int? trials = 3, double? hours = null) => new()
    {
        Name = "test",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Budget = new SearchBudget(trials, hours),
    };

    private SearchCoordinator Coordinator(int? trials = 3, double? hours = null, IEnumerable<TrialRecord>? history = null, double spent = 0) =>
        new(Definition(trials, hours), schedule, journal, time, new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(30), MaxAttempts = 2 }, history, spent);

    [Fact]
    public void Leases_a_new_trial_and_commits_it_before_answering()
    {
        var coordinator = Coordinator();

        var grant = coordinator.Lease("w1", "0");

        Assert.Equal(LeaseKind.Granted, grant.Kind);
        Assert.Equal(1, grant.Trial!.Id);
        Assert.Equal(TrialState.Running, grant.Trial.State);
        Assert.Equal(1, grant.Trial.Attempt);
        Assert.Equal(time.GetUtcNow().AddSeconds(30), grant.Trial.LeaseExpires);
        Assert.Equal([TrialState.Queued, TrialState.Running], journal.Saved.Select(t => t.State));
        Assert.Equal(journal.Saved, schedule.Observed);
    }

    [Fact]
    public void Finishes_when_the_trial_budget_is_spent_and_nothing_runs()
    {
        var coordinator = Coordinator(trials: 2);
        var a = coordinator.Lease("w1", "0").Trial!;
        var b = coordinator.Lease("w1", "1").Trial!;

        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w1", "2").Kind);
        Assert.True(coordinator.Complete(a.Id, a.Attempt, 0.5, [0.5]));
        Assert.True(coordinator.Complete(b.Id, b.Attempt, 0.4, [0.4]));

        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w1", "0").Kind);
        var progress = coordinator.Progress();
        Assert.True(progress.Finished);
        Assert.Equal(StopReason.TrialBudget, progress.Stopping);
        Assert.Equal(2, progress.Done);
        Assert.Equal(0.4, progress.Best);
    }

    [Fact]
    public void Requeues_the_trial_when_its_lease_expires_and_ignores_the_late_report()
    {
        var coordinator = Coordinator();
        var first = coordinator.Lease("w1", "0").Trial!;

        time.Advance(TimeSpan.FromSeconds(31));
        var second = coordinator.Lease("w2", "0").Trial!;

        Assert.Equal(first.Id, second.Id);
        Assert.Equal(2, second.Attempt);
        Assert.Equal(1, second.Failures);
        Assert.Contains("attempt 1: lease expired on w1/0", second.LostAttempts);
        Assert.False(coordinator.Complete(first.Id, first.Attempt, 0.1, [0.1]));
        Assert.True(coordinator.Complete(second.Id, second.Attempt, 0.2, [0.2]));
        Assert.Equal(0.2, journal.Latest().Single(t => t.Id == first.Id).Score);
    }

    [Fact]
    public void A_renewed_lease_does_not_expire()
    {
        var coordinator = Coordinator();
        var trial = coordinator.Lease("w1", "0").Trial!;

        time.Advance(TimeSpan.FromSeconds(20));
        Assert.True(coordinator.Renew(trial.Id, trial.Attempt));
        time.Advance(TimeSpan.FromSeconds(20));
        coordinator.ExpireLeases();

        Assert.True(coordinator.Complete(trial.Id, trial.Attempt, 0.3, [0.3]));
    }

    [Fact]
    public void Fails_a_trial_that_loses_its_lease_too_often()
    {
        var coordinator = Coordinator(trials: 1);
        var first = coordinator.Lease("w1", "0").Trial!;
        Assert.True(coordinator.Release(first.Id, first.Attempt, "out of memory", interrupted: false));
        var second = coordinator.Lease("w1", "0").Trial!;

        Assert.True(coordinator.Release(second.Id, second.Attempt, "out of memory", interrupted: false));

        var failed = journal.Latest().Single();
        Assert.Equal(TrialState.Failed, failed.State);
        Assert.StartsWith("gave up after 2 lost attempts", failed.FailureReason, StringComparison.Ordinal);
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w1", "0").Kind);
    }

    [Fact]
    public void An_interruption_queues_the_trial_again_without_counting_a_failure()
    {
        var coordinator = Coordinator();
        var trial = coordinator.Lease("w1", "0").Trial!;

        Assert.True(coordinator.Release(trial.Id, trial.Attempt, "worker stopping", interrupted: true));

        var again = coordinator.Lease("w1", "0").Trial!;
        Assert.Equal(trial.Id, again.Id);
        Assert.Equal(0, again.Failures);
    }

    [Fact]
    public void Resuming_keeps_done_trials_and_queues_running_ones_again()
    {
        var before = Coordinator(trials: 3);
        var done = before.Lease("w1", "0").Trial!;
        before.Complete(done.Id, done.Attempt, 0.7, [0.7]);
        var cut = before.Lease("w1", "0").Trial!;
        var history = journal.Latest();

        var resumed = new SearchCoordinator(Definition(3), new CountingSchedule(), journal, time, null, history, spentSeconds: 100);
        var next = resumed.Lease("w9", "0").Trial!;

        Assert.Equal(cut.Id, next.Id);
        Assert.Equal(cut.Attempt + 1, next.Attempt);
        Assert.Contains(next.LostAttempts, l => l.Contains("interrupted", StringComparison.Ordinal));
        Assert.Equal(0.7, resumed.Trials().Single(t => t.Id == done.Id).Score);
        Assert.Equal(3, resumed.Lease("w9", "1").Trial!.Id);
        Assert.Equal(100, resumed.Progress().SpentSeconds, 6);
    }

    [Fact]
    public void Stops_creating_trials_once_the_hours_budget_is_spent_including_earlier_sessions()
    {
        var coordinator = Coordinator(trials: null, hours: 1, spent: 3000);
        var trial = coordinator.Lease("w1", "0").Trial!;

        time.Advance(TimeSpan.FromSeconds(601));
        coordinator.Complete(trial.Id, trial.Attempt, 0.5, [0.5]);

        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w1", "0").Kind);
        Assert.Equal(StopReason.HoursBudget, coordinator.Progress().Stopping);
    }

    [Fact]
    public void A_journal_failure_leaves_the_coordinator_unchanged()
    {
        var coordinator = Coordinator();
        var trial = coordinator.Lease("w1", "0").Trial!;
        journal.FailNextSave = true;

        Assert.Throws<IOException>(() => coordinator.Complete(trial.Id, trial.Attempt, 0.5, [0.5]));

        Assert.Equal(1, coordinator.Progress().Running);
        Assert.True(coordinator.Complete(trial.Id, trial.Attempt, 0.5, [0.5]));
    }

    [Fact]
    public void A_stop_request_lets_running_trials_finish_and_starts_no_more()
    {
        var coordinator = Coordinator(trials: 10);
        var trial = coordinator.Lease("w1", "0").Trial!;

        coordinator.RequestStop();

        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w1", "1").Kind);
        coordinator.Complete(trial.Id, trial.Attempt, 0.5, [0.5]);
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w1", "1").Kind);
    }

    [Fact]
    public void Stops_when_the_schedule_is_stuck_with_nothing_running()
    {
        var coordinator = Coordinator(trials: 10);
        schedule.Hold = true;

        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w1", "0").Kind);
        Assert.Equal(StopReason.ScheduleExhausted, coordinator.Progress().Stopping);
    }

    [Fact]
    public void A_promotion_shares_its_first_candidates_seed()
    {
        var promoting = new PromotingSchedule();
        var coordinator = new SearchCoordinator(Definition(3), promoting, journal, time);
        var first = coordinator.Lease("w1", "0");
        coordinator.Complete(first.Trial!.Id, first.Trial.Attempt, 0.5, [0.5]);

        var promoted = coordinator.Lease("w1", "0");

        Assert.Equal(first.Trial.Id, promoted.Trial!.ParentId);
        Assert.Equal(first.Seed, promoted.Seed);
    }

    [Fact]
    public void Each_family_predicts_the_test_table_by_its_own_full_budget()
    {
        // Given LightGBM at the schedule's 400 rounds and a forest whose own full budget is 300 trees
        var definition = Definition(trials: 10) with
        {
            Families =
            [
                new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm),
                new FamilySearch(FamilyNames.Forest, DefaultSpaces.Forest, new FamilyBudget(10, 300)),
            ],
        };
        var coordinator = new SearchCoordinator(definition, schedule, journal, time, new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(30) });

        // When a full-budget LightGBM trial is done, then a forest trial at 300 trees and a short one are leased
        schedule.Budget = definition.Schedule.FullBudget;
        var lightgbm = coordinator.Lease("w1", "0");
        Assert.True(coordinator.Complete(lightgbm.Trial!.Id, lightgbm.Trial.Attempt, 0.4, [0.4]));
        (schedule.Family, schedule.Budget) = (FamilyNames.Forest, 300);
        var forestFull = coordinator.Lease("w1", "0");
        schedule.Budget = 10;
        var forestShort = coordinator.Lease("w1", "1");

        // Then the forest's 300 trees are its full budget, and its short trial still predicts (no forest trial is done)
        Assert.True(forestFull.PredictsTest);
        Assert.True(forestShort.PredictsTest);

        // And once that forest trial is done, a short forest trial skips the test table
        Assert.True(coordinator.Complete(forestFull.Trial!.Id, forestFull.Trial.Attempt, 0.5, [0.5]));
        Assert.False(coordinator.Lease("w1", "0").PredictsTest);
    }

    [Fact]
    public void A_trial_screened_on_some_folds_never_predicts_the_test_table_nor_counts_as_the_best_or_as_a_full_budget_trial()
    {
        // Given a search whose trials all run the full 400 rounds, the first on 1 fold only
        var coordinator = Coordinator(trials: 10);
        schedule.Budget = Definition().Schedule.FullBudget;
        schedule.Folds = 1;
        var screened = coordinator.Lease("w1", "0");

        // When it finishes with a score better than any whole trial's, and then trials on 1 fold and on every fold are leased
        Assert.True(coordinator.Complete(screened.Trial!.Id, screened.Trial.Attempt, 0.1, [0.1]));
        var screenedAgain = coordinator.Lease("w1", "0");
        schedule.Folds = 0;
        var whole = coordinator.Lease("w1", "1");

        // Then the screened trials skip the test table and the trial on every fold predicts it
        Assert.Equal(1, screened.Trial.Folds);
        Assert.False(screened.PredictsTest);
        Assert.False(screenedAgain.PredictsTest);
        Assert.True(whole.PredictsTest);

        // And the screened score is no best; the whole trial's is
        Assert.Null(coordinator.Progress().Best);
        Assert.True(coordinator.Complete(whole.Trial!.Id, whole.Trial.Attempt, 0.4, [0.4, 0.4, 0.4, 0.4, 0.4]));
        Assert.Equal(0.4, coordinator.Progress().Best);
    }

    [Fact]
    public void A_trial_below_the_full_budget_predicts_the_test_table_only_until_a_full_budget_trial_is_done()
    {
        // Given a search whose full budget is 400 rounds
        var coordinator = Coordinator(trials: 10);
        int fullBudget = Definition().Schedule.FullBudget;

        // When a short trial is leased before any full-budget trial is done, then a full-budget trial finishes
        schedule.Budget = 10;
        var before = coordinator.Lease("w1", "0");
        schedule.Budget = fullBudget;
        var full = coordinator.Lease("w1", "1");
        Assert.True(coordinator.Complete(full.Trial!.Id, full.Trial.Attempt, 0.4, [0.4]));
        schedule.Budget = 10;
        var after = coordinator.Lease("w1", "1");
        schedule.Budget = fullBudget;
        var fullAfter = coordinator.Lease("w1", "2");

        // Then the first short trial predicts it (the blend would fall back to it), the later one does not, full-budget trials always do
        Assert.True(before.PredictsTest);
        Assert.True(full.PredictsTest);
        Assert.False(after.PredictsTest);
        Assert.True(fullAfter.PredictsTest);
    }

    [Fact]
    public void A_done_trial_keeps_the_round_count_it_reported()
    {
        var coordinator = Coordinator();
        var grant = coordinator.Lease("w1", "0");

        Assert.True(coordinator.Complete(grant.Trial!.Id, grant.Trial.Attempt, 0.5, [0.5], bestRound: 7));

        Assert.Equal(7, coordinator.Trial(grant.Trial.Id)!.BestRound);
        Assert.Equal(7, journal.Saved[^1].BestRound);
    }

    private sealed class PromotingSchedule : ISchedule
    {
        private TrialRecord? done;

        public bool Exhausted => false;

        public void Observe(TrialRecord trial) => done = trial.State == TrialState.Done ? trial : done;

        public TrialPlan? NextPlan() => done is null
            ? new TrialPlan(FamilyNames.LightGbm, ParameterSet.Empty, 10, 0, null, "first")
            : new TrialPlan(done.Family, done.Parameters, 30, 1, done.Id, "promotion");
    }
}
