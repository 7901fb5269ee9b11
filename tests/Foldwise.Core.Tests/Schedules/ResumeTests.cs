using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Core.Tests.Schedules;

public sealed class ResumeTests
{
    public static TheoryData<ScheduleKind, ProposerKind, int> Kinds => new()
    {
        { ScheduleKind.Asha, ProposerKind.Tpe, 1 },
        { ScheduleKind.Asha, ProposerKind.Tpe, 3 },
        { ScheduleKind.Hyperband, ProposerKind.Tpe, 1 },
        { ScheduleKind.Full, ProposerKind.Tpe, 1 },
        { ScheduleKind.Asha, ProposerKind.Random, 1 },
    };

    [Theory]
    [MemberData(nameof(Kinds))]
    public void Replaying_the_journal_into_a_fresh_schedule_gives_the_same_next_plans(ScheduleKind kind, ProposerKind proposer, int brackets)
    {
        // Given a search that ran 150 trials on four slots, with failures and lost leases along the way
        var definition = FakeCoordinator.Definition(new ScheduleOptions(kind, proposer, FirstRung: 1, FullBudget: 27, Eta: 3, Brackets: brackets), seed: 11,
            FakeCoordinator.Family("first"), FakeCoordinator.Family("second"));
        var original = new FakeCoordinator(ScheduleFactory.Create(definition));
        Simulate(original, trials: 150, slots: 4, seed: 5);

        // When a fresh schedule from the same definition sees the same journal
        var resumed = ScheduleFactory.Create(definition);
        foreach (var record in original.Journal)
        {
            resumed.Observe(record);
        }

        // Then both decide the same, and keep deciding the same as the search goes on
        var again = new FakeCoordinator(resumed);
        foreach (var record in original.Journal.DistinctBy(r => r.Id).Select(r => original[r.Id]))
        {
            again.Adopt(record);
        }

        Assert.Equal(original.Schedule.NextPlan(), resumed.NextPlan());
        Simulate(original, trials: 40, slots: 4, seed: 9);
        Simulate(again, trials: 40, slots: 4, seed: 9);
        Assert.Equal(original.Trials.Select(t => (t.Family, t.Parameters, t.Budget, t.ParentId)), again.Trials.Select(t => (t.Family, t.Parameters, t.Budget, t.ParentId)));
        Assert.Equal(original.Trials.Select(t => t.Bracket), again.Trials.Select(t => t.Bracket));
    }

    [Fact]
    public void A_different_seed_proposes_different_candidates()
    {
        var options = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, 1, 27, 3);
        var one = ScheduleFactory.Create(FakeCoordinator.Definition(options, 1, FakeCoordinator.Family("first")));
        var two = ScheduleFactory.Create(FakeCoordinator.Definition(options, 2, FakeCoordinator.Family("first")));

        Assert.NotEqual(one.NextPlan()!.Parameters, two.NextPlan()!.Parameters);
    }

    /// <summary>Keeps the slots busy, finishing a random running trial each step (some fail, some lose their lease).</summary>
    internal static void Simulate(FakeCoordinator coordinator, int trials, int slots, int seed)
    {
        var random = new Random(seed);
        int target = coordinator.Trials.Count() + trials;
        while (coordinator.Trials.Count() < target)
        {
            var running = coordinator.Trials.Where(t => t.State == TrialState.Running).ToList();
            if (running.Count < slots && coordinator.CreateNext() is not null)
            {
                continue;
            }

            var pick = running[random.Next(running.Count)];
            double roll = random.NextDouble();
            if (roll < 0.05)
            {
                coordinator.Requeue(pick.Id);
            }
            else if (roll < 0.10)
            {
                coordinator.Fail(pick.Id);
            }
            else
            {
                coordinator.Finish(pick.Id, FakeCoordinator.Score(pick) + (0.01 * random.NextDouble()));
            }
        }
    }
}
