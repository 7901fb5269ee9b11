using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;

namespace Foldwise.Core.Tests.Schedules;

public sealed class ScheduleFactoryTests
{
    [Theory]
    [InlineData(ScheduleKind.Full, typeof(FullBudgetSchedule))]
    [InlineData(ScheduleKind.Asha, typeof(AshaSchedule))]
    [InlineData(ScheduleKind.Hyperband, typeof(HyperbandSchedule))]
    public void Builds_the_schedule_the_definition_names(ScheduleKind kind, Type expected)
    {
        var definition = FakeCoordinator.Definition(new ScheduleOptions(kind), seed: 1, FakeCoordinator.Family("first"));

        Assert.IsType(expected, ScheduleFactory.Create(definition));
    }

    [Theory]
    [InlineData(ProposerKind.Random, typeof(RandomProposer))]
    [InlineData(ProposerKind.Tpe, typeof(TpeProposer))]
    public void Builds_the_proposer_the_definition_names(ProposerKind kind, Type expected) =>
        Assert.IsType(expected, ScheduleFactory.CreateProposer(kind));

    [Fact]
    public void Full_budget_plans_new_candidates_at_the_maximum_budget_in_family_turns()
    {
        // Given the default budgets (25 to 400) with two families
        var schedule = ScheduleFactory.Create(FakeCoordinator.Definition(
            new ScheduleOptions(ScheduleKind.Full, ProposerKind.Random), seed: 1, FakeCoordinator.Family("first"), FakeCoordinator.Family("second")));
        var coordinator = new FakeCoordinator(schedule);

        // When four plans are made
        var trials = Enumerable.Range(0, 4).Select(_ => coordinator.CreateNext()!).ToList();

        // Then each is a new candidate at 400 rounds, the families alternating
        Assert.All(trials, t => Assert.Equal((400, 0, (int?)null, 0), (t.Budget, t.Rung, t.ParentId, t.Bracket)));
        Assert.Equal(["first", "second", "first", "second"], trials.Select(t => t.Family));
        Assert.False(schedule.Exhausted);
    }

    [Fact]
    public void Rejects_a_definition_without_families_or_with_a_family_twice()
    {
        var options = new ScheduleOptions();
        Assert.Throws<ArgumentException>(() => ScheduleFactory.Create(FakeCoordinator.Definition(options, 1)));
        Assert.Throws<ArgumentException>(() => ScheduleFactory.Create(
            FakeCoordinator.Definition(options, 1, FakeCoordinator.Family("first"), FakeCoordinator.Family("first"))));
    }
}
