using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Core.Tests.Schedules;

/// <summary>ASHA with rungs that count folds (racing over folds): every trial trains the full budget.</summary>
public sealed class FoldScreenTests
{
    private static AshaSchedule Schedule(int screenFolds, int eta, params string[] families) =>
        new(FakeCoordinator.Families(families), new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 20, FullBudget: 180, Eta: eta, ScreenFolds: screenFolds), new RandomProposer(), seed: 7, folds: 5);

    [Fact]
    public void Rungs_count_folds_from_the_screen_up_to_the_plan()
    {
        Assert.Equal([1, 5], Schedule(1, 5, "only").BudgetsOf(0).ToArray());
        Assert.Equal([1, 3, 5], Schedule(1, 3, "only").BudgetsOf(0).ToArray());
        Assert.Equal([2, 5], Schedule(2, 3, "only").BudgetsOf(0).ToArray());
    }

    [Fact]
    public void New_candidates_train_the_full_budget_on_the_first_folds_and_the_best_of_each_five_trains_them_all()
    {
        // Given a screen of one fold out of five, η 5
        var coordinator = new FakeCoordinator(Schedule(1, 5, "only"));

        // When five new candidates finish on their one fold
        var screened = Enumerable.Range(0, 5).Select(_ => coordinator.CreateNext()!).ToList();
        double[] scores = [0.50, 0.40, 0.10, 0.30, 0.20];
        for (int i = 0; i < 5; i++)
        {
            coordinator.Finish(screened[i].Id, scores[i]);
        }

        // Then each trained 180 rounds on fold 1 only, and the best of the five (trial 3) is promoted to every fold at the same budget
        Assert.All(screened, t => Assert.Equal((180, 1, 0, false), (t.Budget, t.Folds, t.Rung, t.AllFolds)));
        var promoted = coordinator.CreateNext()!;
        Assert.Equal((3, 180, 0, 1, true), (promoted.ParentId!.Value, promoted.Budget, promoted.Folds, promoted.Rung, promoted.AllFolds));
        Assert.Equal(0, coordinator.CreateNext()!.Rung);
    }

    [Fact]
    public void Hyperband_over_folds_screens_five_on_one_fold_promotes_the_best_then_starts_two_on_every_fold()
    {
        // Given Hyperband over folds 1 → 5, η 5: s_max = 1, bracket s=1 starts ⌈2/2·5⌉ = 5 on one fold and keeps 1;
        // bracket s=0 starts ⌈2/1·1⌉ = 2 on every fold (Li et al., JMLR 2018, Algorithm 1)
        var schedule = new HyperbandSchedule(FakeCoordinator.Families("only"), new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, FirstRung: 20, FullBudget: 180, Eta: 5, ScreenFolds: 1), new RandomProposer(), seed: 7, folds: 5);
        var coordinator = new FakeCoordinator(schedule);

        // When the five screens finish
        var screened = Enumerable.Range(0, 5).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.Null(coordinator.Schedule.NextPlan());
        double[] scores = [0.50, 0.40, 0.10, 0.30, 0.20];
        for (int i = 0; i < 5; i++)
        {
            coordinator.Finish(screened[i].Id, scores[i]);
        }

        // Then each trained the full 180 rounds on fold 1 only, and the best (trial 3) goes on to every fold
        Assert.All(screened, t => Assert.Equal((180, 1, 0, false), (t.Budget, t.Folds, t.Rung, t.AllFolds)));
        var promoted = coordinator.CreateNext()!;
        Assert.Equal((3, 180, 1, true), (promoted.ParentId!.Value, promoted.Budget, promoted.Rung, promoted.AllFolds));
        Assert.Null(coordinator.Schedule.NextPlan());

        // And once it finishes the next bracket starts two new candidates on every fold
        coordinator.Finish(promoted.Id, 0.15);
        var whole = Enumerable.Range(0, 2).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.All(whole, t => Assert.Equal((180, true, (int?)null, 2), (t.Budget, t.AllFolds, t.ParentId, t.Bracket)));
    }

    [Fact]
    public void A_screen_as_wide_as_the_plan_is_refused()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Schedule(5, 3, "only"));
        Assert.Contains("fewer than the plan's 5 folds", error.Message, StringComparison.Ordinal);
        var hyperband = Assert.Throws<ArgumentOutOfRangeException>(() => new HyperbandSchedule(FakeCoordinator.Families("only"), new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, 20, 180, 3, ScreenFolds: 5), new RandomProposer(), seed: 7, folds: 5));
        Assert.Contains("fewer than the plan's 5 folds", hyperband.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Reach_orders_by_budget_then_by_folds_with_every_fold_highest()
    {
        TrialReach[] reaches = [new(180, 0), new(20, 0), new(180, 3), new(180, 1)];
        Assert.Equal([new(20, 0), new(180, 1), new(180, 3), new(180, 0)], reaches.Order().ToArray());
        Assert.True(TrialReach.Whole(180) > new TrialReach(180, 4));
    }
}
