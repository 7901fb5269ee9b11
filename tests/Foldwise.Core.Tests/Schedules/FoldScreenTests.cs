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
    public void A_screen_as_wide_as_the_plan_is_refused()
    {
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => Schedule(5, 3, "only"));
        Assert.Contains("fewer than the plan's 5 folds", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Reach_orders_by_budget_then_by_folds_with_every_fold_highest()
    {
        TrialReach[] reaches = [new(180, 0), new(20, 0), new(180, 3), new(180, 1)];
        Assert.Equal([new(20, 0), new(180, 1), new(180, 3), new(180, 0)], reaches.Order().ToArray());
        Assert.True(TrialReach.Whole(180) > new TrialReach(180, 4));
    }
}
