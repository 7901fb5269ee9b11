using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;

namespace Foldwise.Core.Tests.Schedules;

public sealed class AshaScheduleTests
{
    private static AshaSchedule Schedule(params string[] families) =>
        new(FakeCoordinator.Families(families), new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Random, FirstRung: 1, FullBudget: 9, Eta: 3), new RandomProposer(), seed: 7);

    [Fact]
    public void Places_rungs_at_first_rung_times_powers_of_eta_ending_with_full_budget()
    {
        Assert.Equal([25, 75, 225, 400], RungBudgets.For(25, 400, 3).ToArray());
        Assert.Equal([1, 3, 9], RungBudgets.For(1, 9, 3).ToArray());
        Assert.Equal([10, 20, 40, 50], RungBudgets.For(10, 50, 2).ToArray());
        Assert.Equal([100], RungBudgets.For(100, 100, 3).ToArray());
    }

    // Hand-worked from the ASHA rule (Li et al., MLSys 2020, Algorithm 2: scan rungs top-down, promote the best
    // not-yet-promoted result in the top ⌊n_k/η⌋ of rung k, else start a new candidate). η = 3, rungs at 1, 3, 9.
    // Trials 1–3 are new candidates already running. Each row: the results that arrive, then the plan expected next
    // (which the coordinator creates as the next trial id, 4, 5, …). Scores of rung k listed best first.
    //
    //  row  results             rung 0 (n, ⌊n/3⌋)                  rung 1 (n, ⌊n/3⌋)   expected plan   → trial
    //   1   1:.50               1 (1,0)                             –                   new             → 4
    //   2   2:.30               2 1 (2,0)                           –                   new             → 5
    //   3   3:.40               2 3 1 (3,1)                         –                   promote 2 to 1  → 6
    //   4   –                   2* 3 1 (3,1)                        –                   new             → 7
    //   5   4:.10               4 2* 3 1 (4,1)                      –                   promote 4 to 1  → 8
    //   6   5:.90               4* 2* 3 1 5 (5,1)                   –                   new             → 9
    //   7   6:.35 (rung 1)      same                                6 (1,0)             new             → 10
    //   8   7:.20               4* 7 2* 3 1 5 (6,2)                 6                   promote 7 to 1  → 11
    //   9   8:.15 (rung 1)      4* 7* 2* 3 1 5 (6,2)                8 6 (2,0)           new             → 12
    //  10   9:failed            unchanged (a failure has no score)  8 6                 new             → 13
    //  11   11:.25 12:.02       12 4* 7* 2* 3 1 5 (7,2)             8 11 6 (3,1)        promote 8 to 2  → 14 (top-down: rung 1 first)
    //  12   –                   12 4* 7* … (7,2)                    8* 11 6 (3,1)       promote 12 to 1 → 15
    //  13   14:.12 (rung 2)     12* 4* 7* 2* 3 1 5 (7,2)            8* 11 6 (3,1)       new             → 16
    //  14   10:.05 13:.60       12* 10 4* 7* 2* 3 1 13 5 (9,3)      8* 11 6             promote 10 to 1 → 17
    //  15   –                   12* 10* 4* … 3 at rank 5 (9,3)      8* 11 6             new             → 18
    //  (* = promoted; a promoted trial that later drops out of the top stays promoted, as in ASHA.)
    private static readonly (string Results, string Expected)[] Walkthrough =
    [
        ("1:.50", "new"),
        ("2:.30", "new"),
        ("3:.40", "promote 2 to 1"),
        ("", "new"),
        ("4:.10", "promote 4 to 1"),
        ("5:.90", "new"),
        ("6:.35", "new"),
        ("7:.20", "promote 7 to 1"),
        ("8:.15", "new"),
        ("9:failed", "new"),
        ("11:.25 12:.02", "promote 8 to 2"),
        ("", "promote 12 to 1"),
        ("14:.12", "new"),
        ("10:.05 13:.60", "promote 10 to 1"),
        ("", "new"),
    ];

    [Fact]
    public void Promotes_exactly_as_the_hand_worked_walkthrough()
    {
        // Given three running new candidates
        var coordinator = new FakeCoordinator(Schedule("only"));
        for (int i = 0; i < 3; i++)
        {
            coordinator.CreateNext();
        }

        foreach (var (results, expected) in Walkthrough)
        {
            // When the row's results arrive
            foreach (string result in results.Split(' ', StringSplitOptions.RemoveEmptyEntries))
            {
                var parts = result.Split(':');
                int id = int.Parse(parts[0], CultureInfo.InvariantCulture);
                if (parts[1] == "failed")
                {
                    coordinator.Fail(id);
                }
                else
                {
                    coordinator.Finish(id, double.Parse(parts[1], CultureInfo.InvariantCulture));
                }
            }

            // Then the next plan is the one worked out by hand
            var trial = coordinator.CreateNext()!;
            Assert.Equal(expected, Describe(trial));
            if (trial.ParentId is int parent)
            {
                Assert.Equal(coordinator[parent].Parameters, trial.Parameters);
                Assert.Equal(Promotion.ProposerName, trial.Proposer);
                Assert.Equal(trial.Rung == 1 ? 3 : 9, trial.Budget);
            }
            else
            {
                Assert.Equal((0, 1, RandomProposer.ProposerName), (trial.Rung, trial.Budget, trial.Proposer));
            }
        }

        Assert.Equal(18, coordinator.Trials.Count());
    }

    [Fact]
    public void Takes_families_in_turn_for_new_candidates_and_promotes_within_each_family()
    {
        // Given two families whose new candidates alternate
        var coordinator = new FakeCoordinator(Schedule("first", "second"));
        var created = Enumerable.Range(0, 6).Select(_ => coordinator.CreateNext()!).ToList();
        Assert.Equal(["first", "second", "first", "second", "first", "second"], created.Select(t => t.Family));

        // When the three trials of "second" finish (ids 2, 4, 6) with scores far better than anything of "first"
        coordinator.Finish(2, 0.3);
        coordinator.Finish(4, 0.1);
        coordinator.Finish(6, 0.2);
        coordinator.Finish(1, 5.0);

        // Then "second" promotes its best from its own rung, while "first" (one result, ⌊1/3⌋ = 0) promotes nothing
        var next = coordinator.CreateNext()!;
        Assert.Equal(("second", 4, 1), (next.Family, next.ParentId!.Value, next.Rung));
        var after = coordinator.CreateNext()!;
        Assert.Equal(("first", null, 0), (after.Family, after.ParentId, after.Rung));
    }

    [Fact]
    public void Ignores_a_record_seen_twice_and_a_lost_lease()
    {
        // Given three finished candidates, the best promoted
        var coordinator = new FakeCoordinator(Schedule("only"));
        for (int i = 0; i < 4; i++)
        {
            coordinator.CreateNext();
        }

        coordinator.Requeue(4);
        coordinator.Finish(1, 0.1);
        coordinator.Finish(2, 0.2);
        coordinator.Finish(3, 0.3);
        coordinator.Schedule.Observe(coordinator[1]);
        var promoted = coordinator.CreateNext()!;
        Assert.Equal(1, promoted.ParentId);

        // When the same Done record arrives again
        coordinator.Schedule.Observe(coordinator[2]);
        coordinator.Schedule.Observe(coordinator[2] with { State = TrialState.Running });

        // Then n is still 3: trial 2 is not in the top ⌊3/3⌋ = 1, so a new candidate follows
        Assert.Null(coordinator.CreateNext()!.ParentId);
    }

    private static string Describe(TrialRecord trial) =>
        trial.ParentId is int parent ? $"promote {parent} to {trial.Rung}" : "new";
}
