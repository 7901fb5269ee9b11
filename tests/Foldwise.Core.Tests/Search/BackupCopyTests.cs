using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Search;

/// <summary>An idle slot backs up a trial running far longer than expected; the first copy to report wins.</summary>
public sealed class BackupCopyTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 1, 9, 0, 0, TimeSpan.Zero));
    private readonly MemoryJournal journal = new();

    /// <summary>
    /// Six trials of 10 s each done on w1 (expected 10 s per trial), then a seventh leased by w1: the last of the
    /// budget (the search drains), or, with <paramref name="scheduleWaits"/>, one while the schedule waits on a rung.
    /// </summary>
    private SearchCoordinator WithLastTrialRunning(double? backupAfter = 2.0, bool scheduleWaits = true)
    {
        var schedule = new CountingSchedule();
        var coordinator = new SearchCoordinator(
            new SearchDefinition
            {
                Name = "test",
                Data = new DataSource("train.csv", "test.csv", "id", "y"),
                Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
                Budget = new SearchBudget(scheduleWaits ? 100 : 7, null),
            },
            schedule,
            journal,
            time,
            new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(60), BackupAfter = backupAfter, BackupMinimumDone = 5 });
        for (int i = 0; i < 6; i++)
        {
            var grant = coordinator.Lease("w1", "0");
            time.Advance(TimeSpan.FromSeconds(10));
            Assert.True(coordinator.Complete(grant.Trial!.Id, grant.Trial.Attempt, 0.5, [0.5]));
        }

        Assert.Equal(7, coordinator.Lease("w1", "0").Trial!.Id);
        schedule.Hold = scheduleWaits;
        return coordinator;
    }

    [Fact]
    public void An_idle_slot_waits_while_the_last_trial_is_within_twice_its_expected_time()
    {
        var coordinator = WithLastTrialRunning();
        time.Advance(TimeSpan.FromSeconds(19));

        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w2", "0").Kind);
    }

    [Fact]
    public void An_idle_slot_on_another_worker_gets_a_backup_copy_of_an_overdue_trial_with_a_new_attempt_and_the_same_seed()
    {
        var coordinator = WithLastTrialRunning();
        var first = coordinator.Trial(7)!;
        time.Advance(TimeSpan.FromSeconds(21));

        // Another slot of the slow worker gets nothing; a slot elsewhere gets the copy; a third slot no second copy.
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w1", "1").Kind);
        var backup = coordinator.Lease("w2", "0");
        Assert.Equal(LeaseKind.Granted, backup.Kind);
        Assert.Equal(7, backup.Trial!.Id);
        Assert.Equal(first.Attempt + 1, backup.Trial.Attempt);
        Assert.Equal(first.Parameters, backup.Trial.Parameters);
        Assert.Equal("w2", backup.Trial.Worker);
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w3", "0").Kind);

        // Both copies hold the trial; the record keeps the first copy's place and the highest attempt.
        Assert.True(coordinator.Holds(7, first.Attempt));
        Assert.True(coordinator.Holds(7, backup.Trial.Attempt));
        Assert.Equal("w1", coordinator.Trial(7)!.Worker);
        Assert.Equal(backup.Trial.Attempt, journal.Saved[^1].Attempt);
    }

    [Fact]
    public void The_first_copy_to_report_wins_and_the_other_is_refused_its_renewal_and_its_report()
    {
        var coordinator = WithLastTrialRunning();
        int firstAttempt = coordinator.Trial(7)!.Attempt;
        time.Advance(TimeSpan.FromSeconds(25));
        var backup = coordinator.Lease("w2", "0").Trial!;
        time.Advance(TimeSpan.FromSeconds(8));

        Assert.True(coordinator.Complete(7, backup.Attempt, 0.42, [0.42]));

        Assert.False(coordinator.Renew(7, firstAttempt));
        Assert.False(coordinator.Complete(7, firstAttempt, 0.40, [0.40]));
        var done = coordinator.Trial(7)!;
        Assert.Equal(TrialState.Done, done.State);
        Assert.Equal(0.42, done.Score);
        Assert.Equal("w2", done.Worker);
        Assert.Equal(TimeSpan.FromSeconds(8), done.Duration);
        Assert.Equal(0, done.Failures);
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w3", "0").Kind);
    }

    [Fact]
    public void When_one_copy_is_lost_the_other_carries_on_without_a_counted_failure_and_attempts_are_never_reused()
    {
        var coordinator = WithLastTrialRunning();
        int firstAttempt = coordinator.Trial(7)!.Attempt;
        time.Advance(TimeSpan.FromSeconds(25));
        var backup = coordinator.Lease("w2", "0").Trial!;

        // The backup's worker errors; the first copy keeps running and can still finish the trial.
        Assert.True(coordinator.Release(7, backup.Attempt, "out of memory", interrupted: false));
        var running = coordinator.Trial(7)!;
        Assert.Equal(TrialState.Running, running.State);
        Assert.Equal(0, running.Failures);
        Assert.Equal("w1", running.Worker);
        Assert.Contains(running.LostAttempts, l => l.Contains($"attempt {backup.Attempt}: out of memory", StringComparison.Ordinal));
        Assert.False(coordinator.Renew(7, backup.Attempt));

        // Then the first copy's lease runs out too: the trial is queued and the next lease is a fresh attempt.
        time.Advance(TimeSpan.FromSeconds(61));
        coordinator.ExpireLeases();
        Assert.Equal(TrialState.Queued, coordinator.Trial(7)!.State);
        Assert.Equal(1, coordinator.Trial(7)!.Failures);
        var again = coordinator.Lease("w3", "0").Trial!;
        Assert.Equal(backup.Attempt + 1, again.Attempt);
        Assert.True(again.Attempt > firstAttempt);
    }

    [Fact]
    public void A_renewal_keeps_each_copy_alive_on_its_own()
    {
        var coordinator = WithLastTrialRunning();
        int firstAttempt = coordinator.Trial(7)!.Attempt;
        time.Advance(TimeSpan.FromSeconds(25));
        var backup = coordinator.Lease("w2", "0").Trial!;

        // Only the backup renews; the first copy's lease (leased at +0 s, 60 s) runs out, the backup's does not.
        time.Advance(TimeSpan.FromSeconds(30));
        Assert.True(coordinator.Renew(7, backup.Attempt));
        time.Advance(TimeSpan.FromSeconds(10));
        coordinator.ExpireLeases();

        Assert.False(coordinator.Holds(7, firstAttempt));
        Assert.True(coordinator.Holds(7, backup.Attempt));
        Assert.Equal("w2", coordinator.Trial(7)!.Worker);
        Assert.Equal(0, coordinator.Trial(7)!.Failures);
    }

    [Fact]
    public void Once_the_budget_is_spent_a_trial_past_its_expected_time_is_backed_up_up_to_three_copies()
    {
        var coordinator = WithLastTrialRunning(scheduleWaits: false);
        time.Advance(TimeSpan.FromSeconds(9));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w2", "0").Kind);

        time.Advance(TimeSpan.FromSeconds(2));
        Assert.Equal(7, coordinator.Lease("w2", "0").Trial!.Id);

        // The newest copy gets its own expected time before a third starts; there is never a fourth.
        time.Advance(TimeSpan.FromSeconds(9));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w3", "0").Kind);
        time.Advance(TimeSpan.FromSeconds(2));
        Assert.Equal(7, coordinator.Lease("w3", "0").Trial!.Id);
        time.Advance(TimeSpan.FromSeconds(30));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w4", "0").Kind);
    }

    [Fact]
    public void No_backups_when_switched_off()
    {
        var coordinator = WithLastTrialRunning(backupAfter: null);
        time.Advance(TimeSpan.FromSeconds(50));

        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w2", "0").Kind);
    }
}
