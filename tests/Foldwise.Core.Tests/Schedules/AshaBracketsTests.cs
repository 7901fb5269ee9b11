using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Core.Tests.Schedules;

public sealed class AshaBracketsTests
{
    [Fact]
    public void A_bracket_costs_its_first_rung_plus_the_expected_rounds_of_its_survivors()
    {
        // Hand-worked: rungs 20, 60, 180 at η 3. Bracket 0: 20 + 60/3 + 180/9 = 60; bracket 1: 60 + 180/3 = 120; bracket 2: 180.
        var three = AshaBrackets.For([20, 60, 180], eta: 3, count: 3);
        Assert.Equal([60.0, 120.0, 180.0], Enumerable.Range(0, 3).Select(three.CostOf));

        // The default rungs 25, 75, 225, 400: 25 + 25 + 25 + 400/27, then 75 + 75 + 400/9, 225 + 400/3, 400.
        var four = AshaBrackets.For([25, 75, 225, 400], eta: 3, count: 4);
        double[] expected = [75 + (400 / 27.0), 150 + (400 / 9.0), 225 + (400 / 3.0), 400.0];
        for (int b = 0; b < 4; b++)
        {
            Assert.Equal(expected[b], four.CostOf(b), 9);
        }
    }

    [Fact]
    public void New_candidates_go_to_the_bracket_furthest_behind_an_equal_share_of_compute()
    {
        // Given costs 60, 120, 180 (worked above), each start adds its cost to its bracket's spending
        var brackets = AshaBrackets.For([20, 60, 180], eta: 3, count: 3);
        var started = new int[3];
        var order = new List<int>();
        for (int i = 0; i < 110; i++)
        {
            int b = brackets.Next(started);
            order.Add(b);
            started[b]++;
        }

        // Then the first ten, worked by hand (lowest spending after the start; ties to the more aggressive bracket):
        // (60,120,180)→0, (120,120,180)→0, (180,120,180)→1, (180,240,180)→0, (240,240,180)→2, (240,240,360)→0,
        // (300,240,360)→1, (300,360,360)→0, (360,360,360)→0, (420,360,360)→1
        Assert.Equal([0, 0, 1, 0, 2, 0, 1, 0, 0, 1], order.Take(10));

        // And over many candidates the counts approach 6 : 3 : 2, equal compute per bracket (each Hyperband bracket is given the same budget B: Li et al., JMLR 18(185), 2018, Algorithm 1)
        Assert.Equal([60, 30, 20], started);
    }

    [Fact]
    public void Refuses_more_brackets_than_rungs()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => AshaBrackets.For([1, 3, 9], 3, 4));
        Assert.Throws<ArgumentOutOfRangeException>(() => AshaBrackets.For([1, 3, 9], 3, 0));
    }

    // Rungs 1, 3, 9 at η 3 in three brackets: costs 3, 6, 9, so new candidates go to brackets 0, 0, 1, 0, 2, 0, 1, 0, 0, 1
    // as above, starting at rung 0, 0, 1, 0, 2, … Trials carry the bracket as 1, 2, 3. Hand-worked:
    //   trials 1–5 start: 1 (b0, rung 0), 2 (b0), 3 (b1, rung 1, 3 rounds), 4 (b0), 5 (b2, rung 2, 9 rounds)
    //   1:.5 2:.4 4:.6     b0 rung 0 holds 2 1 4, ⌊3/3⌋ = 1                     → promote 2 to rung 1, in b0   → 6
    //   3:.1 6:.3          b0 rung 1 holds 6; b1 rung 1 holds 3                  → new in b0                    → 7
    //   –                                                                         → new in b1, at rung 1         → 8
    //   8:.2               b1 rung 1 holds 3 8; b0 rung 1 holds 6: together three
    //                      results whose best (3) plain ASHA would promote, but
    //                      each bracket ranks alone: ⌊2/3⌋ = ⌊1/3⌋ = 0            → new in b0                    → 9
    //   7:.7 9:.8          b0 rung 0 holds 2* 1 4 7 9, ⌊5/3⌋ = 1, 2 promoted      → new in b0                    → 10
    //   –                                                                         → new in b1, at rung 1         → 11
    //   11:.05             b1 rung 1 holds 11 3 8, ⌊3/3⌋ = 1                      → promote 11 to rung 2, in b1  → 12
    [Fact]
    public void Starts_each_bracket_at_its_own_rung_and_promotes_within_the_bracket_as_worked_by_hand()
    {
        var options = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 1, FullBudget: 9, Eta: 3, Brackets: 3);
        var coordinator = new FakeCoordinator(new AshaSchedule(FakeCoordinator.Families("only"), options, new RandomProposer(), seed: 7));
        var first = Enumerable.Range(0, 5).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.Equal([(0, 1, 1), (0, 1, 1), (1, 3, 2), (0, 1, 1), (2, 9, 3)], first.Select(t => (t.Rung, t.Budget, t.Bracket)));

        coordinator.Finish(1, 0.5);
        coordinator.Finish(2, 0.4);
        coordinator.Finish(4, 0.6);
        Assert.Equal((2, 1, 3, 1), Step(coordinator));

        coordinator.Finish(3, 0.1);
        coordinator.Finish(6, 0.3);
        Assert.Equal((null, 0, 1, 1), Step(coordinator));
        Assert.Equal((null, 1, 3, 2), Step(coordinator));

        coordinator.Finish(8, 0.2);
        Assert.Equal((null, 0, 1, 1), Step(coordinator));

        coordinator.Finish(7, 0.7);
        coordinator.Finish(9, 0.8);
        Assert.Equal((null, 0, 1, 1), Step(coordinator));
        Assert.Equal((null, 1, 3, 2), Step(coordinator));

        coordinator.Finish(11, 0.05);
        Assert.Equal((11, 2, 9, 2), Step(coordinator));
        Assert.Equal(coordinator[11].Parameters, coordinator[12].Parameters);
    }

    [Fact]
    public void A_trial_without_a_bracket_counts_in_the_first_so_a_store_from_plain_asha_resumes_into_brackets()
    {
        // Given three results of plain ASHA (bracket 0 on the record), the best at .1
        var options = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 1, FullBudget: 9, Eta: 3, Brackets: 2);
        var schedule = new AshaSchedule(FakeCoordinator.Families("only"), options, new RandomProposer(), seed: 7);
        var plain = new FakeCoordinator(new AshaSchedule(FakeCoordinator.Families("only"), options with { Brackets = 1 }, new RandomProposer(), seed: 7));
        for (int i = 1; i <= 3; i++)
        {
            plain.CreateNext();
            plain.Finish(i, i / 10.0);
        }

        // When a schedule with two brackets replays them
        foreach (var record in plain.Journal)
        {
            schedule.Observe(record);
        }

        // Then they rank in its first bracket: trial 1 is promoted there
        var plan = schedule.NextPlan()!;
        Assert.Equal((1, 1, 1), (plan.ParentId, plan.Rung, plan.Bracket));
    }

    private static (int? Parent, int Rung, int Budget, int Bracket) Step(FakeCoordinator coordinator)
    {
        var trial = coordinator.CreateNext()!;
        return (trial.ParentId, trial.Rung, trial.Budget, trial.Bracket);
    }
}
