using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Search;

public sealed class HoursParkingTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 1, 9, 0, 0, TimeSpan.Zero));

    private static SearchDefinition Definition(int? trials, double hours, params FamilySearch[] families) => new()
    {
        Name = "test",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [.. families],
        Schedule = ScheduleDefaults.Standard,
        Budget = new SearchBudget(trials, hours),
    };

    private static readonly FamilySearch LightGbm = new(FamilyNames.LightGbm, DefaultSpaces.LightGbm);

    [Fact]
    public void A_slow_familys_trial_that_would_end_after_the_hours_waits_while_a_fast_one_takes_the_slot()
    {
        // Given two families racing over folds for an hour: a LightGBM screen took 1 minute, a FastTree screen 30
        var definition = Definition(null, 1, LightGbm, new FamilySearch(FamilyNames.FastTree, DefaultSpaces.For(FamilyNames.FastTree)));
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), new MemoryJournal(), time);
        var lightgbm = coordinator.Lease("w", "0").Trial!;
        var fasttree = coordinator.Lease("w", "1").Trial!;
        time.Advance(TimeSpan.FromMinutes(1));
        coordinator.Complete(lightgbm.Id, 1, 0.5, [0.5]);
        time.Advance(TimeSpan.FromMinutes(29));
        coordinator.Complete(fasttree.Id, 1, 0.4, [0.4]);

        // When both slots ask with 15 minutes left
        time.Advance(TimeSpan.FromMinutes(15));
        var first = coordinator.Lease("w", "0").Trial!;
        var second = coordinator.Lease("w", "1").Trial!;

        // Then both get LightGBM screens, and the FastTree screen drawn between them waits in the queue for a resume
        Assert.Equal((FamilyNames.LightGbm, FamilyNames.LightGbm), (first.Family, second.Family));
        var waiting = Assert.Single(coordinator.Trials(), t => t.State == TrialState.Queued);
        Assert.Equal((FamilyNames.FastTree, 1), (waiting.Family, waiting.Folds));
        Assert.Null(coordinator.Progress().Stopping);
    }

    [Fact]
    public void Once_more_than_two_trials_per_family_wait_the_search_stops_as_at_its_hours()
    {
        // Given one family whose first trial took 20 minutes of an hour's budget
        var schedule = new CountingSchedule();
        var coordinator = new SearchCoordinator(Definition(null, 1, LightGbm), schedule, new MemoryJournal(), time);
        var trial = coordinator.Lease("w", "0").Trial!;
        time.Advance(TimeSpan.FromMinutes(20));
        coordinator.Complete(trial.Id, 1, 0.5, [0.5]);

        // When a slot asks with 19 minutes left
        time.Advance(TimeSpan.FromMinutes(21));
        var grant = coordinator.Lease("w", "0");

        // Then three trials like it wait for a resume and the search has finished, stopped by its hours
        Assert.Equal(LeaseKind.Finished, grant.Kind);
        Assert.Equal(StopReason.HoursBudget, coordinator.Progress().Stopping);
        Assert.Equal([TrialState.Done, TrialState.Queued, TrialState.Queued, TrialState.Queued], coordinator.Trials().Select(t => t.State));
    }

    [Fact]
    public void A_search_stopped_by_its_trial_budget_finishes_while_trials_held_back_for_the_hours_wait()
    {
        // Given a budget of three trials and an hour, the first trial taking 20 minutes
        var coordinator = new SearchCoordinator(Definition(3, 1, LightGbm), new CountingSchedule(), new MemoryJournal(), time);
        var trial = coordinator.Lease("w", "0").Trial!;
        time.Advance(TimeSpan.FromMinutes(20));
        coordinator.Complete(trial.Id, 1, 0.5, [0.5]);

        // When a slot asks with 19 minutes left
        time.Advance(TimeSpan.FromMinutes(21));
        var grant = coordinator.Lease("w", "0");

        // Then the last two trials of the budget wait for a resume and the search has finished at its trial budget
        Assert.Equal(LeaseKind.Finished, grant.Kind);
        Assert.Equal(StopReason.TrialBudget, coordinator.Progress().Stopping);
        Assert.Equal([TrialState.Done, TrialState.Queued, TrialState.Queued], coordinator.Trials().Select(t => t.State));
    }
}
