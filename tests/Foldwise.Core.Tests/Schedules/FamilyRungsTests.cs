using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;

namespace Foldwise.Core.Tests.Schedules;

public sealed class FamilyRungsTests
{
    private static readonly ScheduleOptions Shared = new(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 1, FullBudget: 9, Eta: 3);

    // "boosted" keeps the schedule's 1, 3, 9; "forest" has its own 10, 30, 90, 270.
    private static FamilySearch[] Families() =>
    [
        FakeCoordinator.Family("boosted"),
        FakeCoordinator.Family("forest") with { Budget = new FamilyBudget(10, 270) },
    ];

    [Fact]
    public void Asha_starts_each_family_at_its_own_first_rung_and_promotes_it_to_its_own_next_rung()
    {
        // Given ASHA over two families with rungs of their own
        var c = new FakeCoordinator(new AshaSchedule([.. Families()], Shared, new RandomProposer(), seed: 3));

        // When six new candidates start (families in turn) and each family's best is promotable
        var started = Enumerable.Range(0, 6).Select(_ => c.CreateNext()!).ToList();
        Assert.Equal([1, 10, 1, 10, 1, 10], started.Select(t => t.Budget));
        foreach (var t in started)
        {
            c.Finish(t.Id, t.Id / 10.0);
        }

        var promoted = new[] { c.CreateNext()!, c.CreateNext()! };

        // Then each promotion runs its family's next rung
        Assert.Equal([("boosted", 3), ("forest", 30)], promoted.Select(t => (t.Family, t.Budget)).OrderBy(p => p.Family));
        Assert.All(promoted, t => Assert.Equal(1, t.Rung));
    }

    [Fact]
    public void Hyperband_runs_each_familys_brackets_over_its_own_rungs()
    {
        var schedule = new HyperbandSchedule([.. Families()], Shared with { Kind = ScheduleKind.Hyperband }, new RandomProposer(), seed: 3);

        Assert.Equal(HyperbandPlan.For(1, 9, 3).Brackets[0], schedule.BracketOf(0, 1));
        Assert.Equal(HyperbandPlan.For(10, 270, 3).Brackets[0], schedule.BracketOf(1, 1));
        Assert.Equal(270, schedule.BracketOf(1, 1).Rungs[^1].Budget);
    }

    [Fact]
    public void A_full_budget_search_runs_each_family_at_its_own_full_budget()
    {
        var c = new FakeCoordinator(new FullBudgetSchedule([.. Families()], Shared with { Kind = ScheduleKind.Full }, new RandomProposer(), seed: 3));

        Assert.Equal([9, 270, 9], Enumerable.Range(0, 3).Select(_ => c.CreateNext()!.Budget));
    }

    [Fact]
    public void Brackets_number_each_familys_hyperband_cycle_on_its_own()
    {
        var definition = FakeCoordinator.Definition(Shared with { Kind = ScheduleKind.Hyperband }, 1, Families());
        var numbers = BracketNumbers.For(definition);

        // 1, 3, 9 has 3 brackets; 10 to 270 has 4
        Assert.Equal(1, numbers.Of("boosted", 4));
        Assert.Equal(4, numbers.Of("forest", 4));
    }
}
