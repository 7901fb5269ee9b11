using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Core.Tests.Search;

/// <summary>A worker is leased only the families it offers, and a worker failing where others succeed is quarantined.</summary>
public sealed class WorkerFamiliesTests
{
    private static readonly string[] FastTreeOnly = [FamilyNames.FastTree];

    private readonly FakeTimeProvider time = new(new DateTimeOffset(2026, 12, 1, 9, 0, 0, TimeSpan.Zero));
    private readonly MemoryJournal journal = new();

    [Fact]
    public void A_worker_without_a_family_is_never_leased_it_and_its_trial_waits_for_another_worker()
    {
        // Given a schedule proposing lightgbm, then fasttree, in turn
        var coordinator = Coordinator(trials: 4);

        // When a worker offering fasttree only asks
        var first = coordinator.Lease("no-lightgbm", "0", FastTreeOnly);

        // Then the lightgbm candidate is queued for others and it waits; while that trial waits it creates no more
        Assert.Equal(LeaseKind.Wait, first.Kind);
        Assert.Equal(LeaseKind.Wait, coordinator.Lease("no-lightgbm", "0", FastTreeOnly).Kind);
        Assert.Equal(1, coordinator.Progress().Queued);

        // When a worker offering every family takes the queued trial, the next one is fasttree, for the first worker
        Assert.Equal(FamilyNames.LightGbm, coordinator.Lease("both", "0").Trial!.Family);
        var second = coordinator.Lease("no-lightgbm", "0", FastTreeOnly);
        Assert.Equal(FamilyNames.FastTree, second.Trial!.Family);
        Assert.All(journal.Saved.Where(t => t.Worker == "no-lightgbm"), t => Assert.Equal(FamilyNames.FastTree, t.Family));
    }

    [Fact]
    public void A_worker_failing_three_trials_in_a_row_while_another_succeeds_is_quarantined_with_the_reason()
    {
        // Given a worker that finished a trial
        var coordinator = Coordinator(trials: 20);
        var good = coordinator.Lease("good", "0").Trial!;
        Assert.True(coordinator.Complete(good.Id, good.Attempt, 0.5, [0.5]));

        // When another worker fails three trials in a row
        for (int i = 0; i < 3; i++)
        {
            var trial = coordinator.Lease("broken", "0").Trial!;
            Assert.True(coordinator.Release(trial.Id, trial.Attempt, "DllNotFoundException: lib_lightgbm", interrupted: false));
        }

        // Then it gets no more work, and progress names it and why
        var refused = coordinator.Lease("broken", "0");
        Assert.Equal(LeaseKind.Quarantined, refused.Kind);
        Assert.Equal("3 trials failed in a row; last: DllNotFoundException: lib_lightgbm", refused.Reason);
        Assert.Equal(refused.Reason, coordinator.Progress().Quarantined!["broken"]);
        Assert.Equal(LeaseKind.Granted, coordinator.Lease("good", "0").Kind);
    }

    [Fact]
    public void When_every_worker_fails_nobody_is_quarantined_and_interruptions_never_count()
    {
        var coordinator = Coordinator(trials: 20);
        for (int i = 0; i < 4; i++)
        {
            var trial = coordinator.Lease("only", "0").Trial!;
            Assert.True(coordinator.Release(trial.Id, trial.Attempt, "the worker stopped", interrupted: i % 2 == 0));
        }

        for (int i = 0; i < 3; i++)
        {
            var trial = coordinator.Lease("only", "0").Trial!;
            Assert.True(coordinator.Release(trial.Id, trial.Attempt, "bad parameters", interrupted: false));
        }

        Assert.Equal(LeaseKind.Granted, coordinator.Lease("only", "0").Kind);
        Assert.Empty(coordinator.Progress().Quarantined!);
    }

    private SearchCoordinator Coordinator(int trials) => new(
        new SearchDefinition
        {
            Name = "test",
            Data = new DataSource("train.csv", "test.csv", "id", "y"),
            Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm), new FamilySearch(FamilyNames.FastTree, DefaultSpaces.FastTree)],
            Budget = new SearchBudget(trials, null),
        },
        new AlternatingSchedule(),
        journal,
        time,
        new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(30), MaxAttempts = 5 });

    /// <summary>New candidates of lightgbm and fasttree in turn.</summary>
    private sealed class AlternatingSchedule : ISchedule
    {
        private int proposed;

        public bool Exhausted => false;

        public void Observe(TrialRecord trial)
        {
            // Proposes regardless of results.
        }

        public TrialPlan? NextPlan()
        {
            string family = proposed++ % 2 == 0 ? FamilyNames.LightGbm : FamilyNames.FastTree;
            return new TrialPlan(family, ParameterSet.Of([new("x", proposed)]), 10, 0, null, "alternating");
        }
    }
}
