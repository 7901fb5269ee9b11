using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;

namespace Foldwise.Core.Tests.Schedules;

public sealed class HyperbandScheduleTests
{
    // Budgets 1..9, η = 3: brackets s=2: (9,1) (3,3) (1,9); s=1: (5,3) (1,9); s=0: (3,9) — by Li et al. 2018, Alg. 1.
    private static HyperbandSchedule Schedule(params string[] families) =>
        new(FakeCoordinator.Families(families), new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, 1, 9, 3), new RandomProposer(), seed: 3);

    [Fact]
    public void Waits_until_a_rung_is_complete_then_promotes_its_top_third_best_first()
    {
        // Given the first bracket's nine new candidates at one round
        var coordinator = new FakeCoordinator(Schedule("only"));
        var first = Enumerable.Range(0, 9).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.All(first, t => Assert.Equal((0, 1, 1, (int?)null), (t.Rung, t.Budget, t.Bracket, t.ParentId)));
        Assert.Null(coordinator.Schedule.NextPlan());

        // When eight of them finish, the schedule still waits for the ninth
        double[] scores = [0.9, 0.4, 0.7, 0.1, 0.8, 0.6, 0.3, 0.5, 0.2];
        for (int id = 1; id <= 8; id++)
        {
            coordinator.Finish(id, scores[id - 1]);
        }

        Assert.Null(coordinator.Schedule.NextPlan());

        // Then once the rung is complete it promotes the top ⌊9/3⌋ = 3 (ids 4, 9, 7 with 0.1, 0.2, 0.3) at 3 rounds
        coordinator.Finish(9, scores[8]);
        var promoted = Enumerable.Range(0, 3).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.Equal([4, 9, 7], promoted.Select(t => t.ParentId!.Value));
        Assert.All(promoted, t => Assert.Equal((1, 3, 1, Promotion.ProposerName), (t.Rung, t.Budget, t.Bracket, t.Proposer)));
        Assert.Equal(coordinator[4].Parameters, promoted[0].Parameters);
        Assert.Null(coordinator.Schedule.NextPlan());

        // And the rung of three, once complete, sends its best (trial 11) on to nine rounds
        coordinator.Finish(10, 0.30);
        coordinator.Finish(12, 0.35);
        Assert.Null(coordinator.Schedule.NextPlan());
        coordinator.Finish(11, 0.25);
        var top = coordinator.CreateNext()!;
        Assert.Equal((11, 2, 9), (top.ParentId!.Value, top.Rung, top.Budget));
        Assert.Null(coordinator.Schedule.NextPlan());

        // And when the bracket is done the next one (s = 1) starts five new candidates at three rounds
        coordinator.Finish(13, 0.2);
        var second = Enumerable.Range(0, 5).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.All(second, t => Assert.Equal((0, 3, 2, (int?)null), (t.Rung, t.Budget, t.Bracket, t.ParentId)));
        Assert.Null(coordinator.Schedule.NextPlan());
    }

    [Fact]
    public void Promotes_only_what_finished_when_trials_of_a_rung_failed()
    {
        // Given bracket s=2 where seven of nine new candidates failed
        var coordinator = new FakeCoordinator(Schedule("only"));
        for (int i = 0; i < 9; i++)
        {
            coordinator.CreateNext();
        }

        for (int id = 1; id <= 7; id++)
        {
            coordinator.Fail(id);
        }

        coordinator.Finish(8, 0.5);
        coordinator.Finish(9, 0.4);

        // Then only the two results can go on, best first, and nothing more starts until they finish
        Assert.Equal(9, coordinator.CreateNext()!.ParentId);
        Assert.Equal(8, coordinator.CreateNext()!.ParentId);
        Assert.Null(coordinator.Schedule.NextPlan());
    }

    [Fact]
    public void Runs_a_copy_of_the_bracket_for_every_family_and_starts_over_after_the_last()
    {
        // Given two families
        var coordinator = new FakeCoordinator(Schedule("first", "second"));

        // Then each gets its own nine new candidates, interleaved
        var created = Enumerable.Range(0, 18).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.Equal(9, created.Count(t => t.Family == "first"));
        Assert.Equal(["first", "second", "first", "second"], created.Take(4).Select(t => t.Family));
        Assert.Null(coordinator.Schedule.NextPlan());

        // When every trial of every bracket finishes as soon as it is created
        var brackets = new List<(int Bracket, int Budget, int Rung)>();
        for (int guard = 0; guard < 200; guard++)
        {
            foreach (var running in coordinator.Trials.Where(t => t.State == global::Foldwise.Core.Search.TrialState.Running).ToList())
            {
                coordinator.Finish(running.Id, FakeCoordinator.Score(running));
            }

            var next = coordinator.CreateNext();
            if (next is null)
            {
                break;
            }

            brackets.Add((next.Bracket, next.Budget, next.Rung));
            if (next.Bracket == 4)
            {
                break;
            }
        }

        // Then brackets 1, 2, 3 run s = 2, 1, 0, and bracket 4 is s = 2 again
        // (per family: bracket 1 promotes 3 then 1; bracket 2 starts 5 and promotes 1; bracket 3 starts 3)
        Assert.Equal(2 * (3 + 1), brackets.Count(b => b.Bracket == 1));
        Assert.Equal(2 * (5 + 1), brackets.Count(b => b.Bracket == 2));
        Assert.Equal(2 * 3, brackets.Count(b => b.Bracket == 3));
        Assert.Contains((3, 9, 0), brackets);
        Assert.DoesNotContain(brackets, b => b.Bracket == 3 && b.Rung > 0);
        Assert.Equal((4, 1, 0), brackets[^1]);
        Assert.Equal(HyperbandPlan.For(1, 9, 3).Brackets[0], ((HyperbandSchedule)coordinator.Schedule).BracketOf(4));
    }
}
