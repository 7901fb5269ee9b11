using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Search;

public sealed class ScreenFinishTests
{
    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 1, 9, 0, 0, TimeSpan.Zero));

    /// <summary>Two families racing over folds (the default schedule) with a budget too small for any ordinary promotion.</summary>
    private SearchCoordinator Coordinator(int? trials, double? hours = null)
    {
        var definition = new SearchDefinition
        {
            Name = "test",
            Data = new DataSource("train.csv", "test.csv", "id", "y"),
            Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm), new FamilySearch(FamilyNames.FastTree, DefaultSpaces.For(FamilyNames.FastTree))],
            Schedule = ScheduleDefaults.Standard,
            Budget = new SearchBudget(trials, hours),
        };
        return new SearchCoordinator(definition, ScheduleFactory.Create(definition), new MemoryJournal(), time);
    }

    [Fact]
    public void A_search_whose_trial_budget_ends_among_screens_promotes_each_familys_best_screen_to_every_fold()
    {
        // Given a budget of three trials, all of them screened on the first fold
        var coordinator = Coordinator(trials: 3);
        var screens = Enumerable.Range(0, 3).Select(i => coordinator.Lease("w", i.ToString()).Trial!).ToList();
        Assert.All(screens, t => Assert.Equal(1, t.Folds));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w", "3").Kind);

        // When they finish, the better LightGBM screen scoring 0.3
        var lightgbm = screens.Where(t => t.Family == FamilyNames.LightGbm).ToList();
        coordinator.Complete(lightgbm[0].Id, 1, 0.5, [0.5]);
        coordinator.Complete(lightgbm[1].Id, 1, 0.3, [0.3]);
        var fasttree = screens.Single(t => t.Family == FamilyNames.FastTree);
        coordinator.Complete(fasttree.Id, 1, 0.4, [0.4]);

        // Then each family's best screen trains every fold, one trial each past the budget, and then the search is finished
        var finishing = new[] { coordinator.Lease("w", "0").Trial!, coordinator.Lease("w", "1").Trial! };
        Assert.Equal(
            [(FamilyNames.LightGbm, lightgbm[1].Id), (FamilyNames.FastTree, fasttree.Id)],
            finishing.Select(t => (t.Family, t.ParentId!.Value)).OrderBy(p => p.Family == FamilyNames.FastTree));
        Assert.All(finishing, t => Assert.Equal((true, Promotion.ProposerName, 1), (t.AllFolds, t.Proposer, t.Rung)));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w", "2").Kind);
        coordinator.Complete(finishing[0].Id, 1, 0.31, [0.3, 0.32]);
        coordinator.Complete(finishing[1].Id, 1, 0.41, [0.4, 0.42]);
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w", "0").Kind);
        Assert.Equal(5, coordinator.Trials().Count);
    }

    [Fact]
    public void A_family_that_already_trained_every_fold_gets_no_extra_trial()
    {
        // Given a budget of twelve trials: ten screens, then the promotions ASHA makes itself once a rung holds five
        var coordinator = Coordinator(trials: 12);
        for (int i = 0; i < 12; i++)
        {
            var trial = coordinator.Lease("w", "0").Trial!;
            coordinator.Complete(trial.Id, 1, 0.5 - (i * 0.01), [0.5]);
        }

        // Then it finishes within its budget: both families have a trial on every fold already
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w", "0").Kind);
        Assert.Equal(12, coordinator.Trials().Count);
        Assert.Equal(2, coordinator.Trials().Count(t => t.AllFolds));
    }

    [Fact]
    public void A_search_whose_hours_end_before_any_trial_trained_every_fold_promotes_the_best_screen_of_all_past_them()
    {
        // Given an hour's budget, two screens running when it ends
        var coordinator = Coordinator(trials: null, hours: 1);
        var lightgbm = coordinator.Lease("w", "0").Trial!;
        var fasttree = coordinator.Lease("w", "1").Trial!;
        time.Advance(TimeSpan.FromHours(2));

        // When they finish, FastTree's screen the better
        coordinator.Complete(lightgbm.Id, 1, 0.4, [0.4]);
        coordinator.Complete(fasttree.Id, 1, 0.3, [0.3]);

        // Then that screen alone trains every fold past the hours, and then the search is finished
        var overtime = coordinator.Lease("w", "0").Trial!;
        Assert.Equal((fasttree.Id, true), (overtime.ParentId!.Value, overtime.AllFolds));
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("w", "1").Kind);
        coordinator.Complete(overtime.Id, 1, 0.31, [0.3, 0.32]);
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w", "0").Kind);
        Assert.Equal(StopReason.HoursBudget, coordinator.Progress().Stopping);
    }

    [Fact]
    public void A_search_whose_hours_end_with_a_trial_on_every_fold_stops_there()
    {
        // Given a screen that was promoted to every fold before the hour was out
        var coordinator = Coordinator(trials: null, hours: 1);
        for (int i = 0; i < 10; i++)
        {
            var trial = coordinator.Lease("w", "0").Trial!;
            coordinator.Complete(trial.Id, 1, 0.5 - (i * 0.01), [0.5]);
        }

        Assert.Contains(coordinator.Trials(), t => t.AllFolds && t.State == TrialState.Done);

        // When the hours run out
        time.Advance(TimeSpan.FromHours(2));

        // Then nothing more runs
        Assert.Equal(LeaseKind.Finished, coordinator.Lease("w", "0").Kind);
    }
}
