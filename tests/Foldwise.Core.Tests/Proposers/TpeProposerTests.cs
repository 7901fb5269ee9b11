using Foldwise.Core.Proposers;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

public sealed class TpeProposerTests
{
    private const int Seeds = 10;

    [Fact]
    public void Finds_the_Branin_minimum_far_better_than_random_search_in_sixty_evaluations()
    {
        // When each proposer minimises Branin with 60 sequential evaluations, over 10 seeds
        double tpe = ProposerRuns.MedianBest(new TpeProposer(), TestFunctions.BraninSpace, TestFunctions.Branin, 60, Seeds);
        double random = ProposerRuns.MedianBest(new RandomProposer(), TestFunctions.BraninSpace, TestFunctions.Branin, 60, Seeds);

        // Then TPE's median best is within 0.1 of the optimum 0.397887 (measured 0.451 with the dims + 1 start-up, 0.422 with the earlier 12; random search: 1.39)
        // and at most half of random search's median best
        Assert.InRange(tpe, TestFunctions.BraninMinimum, TestFunctions.BraninMinimum + 0.1);
        Assert.True(tpe <= 0.5 * random, $"TPE median {tpe:F4} vs random {random:F4}");
    }

    [Fact]
    public void Gets_close_to_the_Hartmann_six_minimum_where_random_search_does_not_in_a_hundred_evaluations()
    {
        // When each proposer minimises Hartmann-6 with 100 sequential evaluations, over 10 seeds
        double tpe = ProposerRuns.MedianBest(new TpeProposer(), TestFunctions.HartmannSpace, TestFunctions.Hartmann, 100, Seeds);
        double random = ProposerRuns.MedianBest(new RandomProposer(), TestFunctions.HartmannSpace, TestFunctions.Hartmann, 100, Seeds);

        // Then TPE's median best is within 0.4 of the optimum −3.32237 (measured −3.170 with the dims + 1 start-up, −3.148 with the earlier 12; random search: −2.147)
        // and at least 0.5 better than random search's median best
        Assert.InRange(tpe, TestFunctions.HartmannMinimum, TestFunctions.HartmannMinimum + 0.4);
        Assert.True(tpe <= random - 0.5, $"TPE median {tpe:F4} vs random {random:F4}");
    }

    [Fact]
    public void The_test_functions_take_their_published_minima()
    {
        // Minima of Branin at (−π, 12.275), (π, 2.275), (9.42478, 2.475) — Dixon & Szegő 1978
        foreach (var (x1, x2) in new[] { (-Math.PI, 12.275), (Math.PI, 2.275), (9.42478, 2.475) })
        {
            Assert.Equal(TestFunctions.BraninMinimum, TestFunctions.Branin(ParameterSet.Of([new("x1", x1), new("x2", x2)])), 5);
        }

        // Hartmann-6 minimum −3.32237 — Surjanovic & Bingham, after Dixon & Szegő 1978
        Assert.Equal(TestFunctions.HartmannMinimum, TestFunctions.Hartmann(TestFunctions.HartmannArgMin), 5);

        // The multi-fidelity versions (Kandasamy et al. 2017) are the originals at the full budget and differ below it
        var branin = ParameterSet.Of([new("x1", Math.PI), new("x2", 2.275)]);
        var hartmann = ParameterSet.Of([.. TestFunctions.HartmannArgMin.Select((x, i) => new KeyValuePair<string, double>($"x{i + 1}", x))]);
        Assert.Equal(TestFunctions.BraninMinimum, TestFunctions.BraninAt(branin, 9, 9), 5);
        Assert.Equal(TestFunctions.HartmannMinimum, TestFunctions.HartmannAt(hartmann, 9, 9), 5);
        Assert.NotEqual(TestFunctions.BraninMinimum, TestFunctions.BraninAt(branin, 1, 9), 2);
        Assert.True(TestFunctions.HartmannAt(hartmann, 1, 9) > TestFunctions.HartmannMinimum + 0.05);
    }

    [Fact]
    public void Proposes_at_random_until_it_has_one_result_more_than_dimensions_then_models()
    {
        // Given a 6-parameter space: start-up is 6 + 1 = 7 results
        var run = ProposerRuns.Minimise(new TpeProposer(), TestFunctions.HartmannSpace, TestFunctions.Hartmann, 14, seed: 1);
        var history = new FamilyHistory("f", TestFunctions.HartmannSpace);
        var names = new List<string>();
        for (int i = 0; i < 14; i++)
        {
            names.Add(new TpeProposer().Propose(history, new Random(i)).Proposer);
            history.Observe(ProposerRuns.Done(i + 1, run.Proposed[i], TestFunctions.Hartmann(run.Proposed[i])));
        }

        Assert.Equal([.. Enumerable.Repeat("random", 7), .. Enumerable.Repeat("tpe", 7)], names);
    }

    [Fact]
    public void Keeps_fixed_ranges_at_their_value_and_every_proposal_valid()
    {
        // Given a space of every kind, with two fixed ranges, and a score that prefers leaves = 20, kind = 2
        var space = new ParameterSpace(
        [
            ParameterRange.Whole("leaves", 8, 128),
            ParameterRange.Log("learning_rate", 0.01, 0.3),
            ParameterRange.Linear("fraction", 0.1, 1.0),
            ParameterRange.OneOf("kind", "a", "b", "c", "d"),
            ParameterRange.Fixed("seed_offset", 3),
            ParameterRange.Whole("depth", 6, 6),
        ]);
        double Score(ParameterSet p) => (Math.Abs(p["leaves"] - 20) / 100) + Math.Abs(Math.Log(p["learning_rate"] / 0.05)) + (p["kind"] == 2 ? 0 : 1);

        // When TPE proposes 80 candidates with 3 always left running (the liars)
        var history = new FamilyHistory("f", space);
        var tpe = new TpeProposer();
        var proposals = new List<Proposal>();
        for (int i = 1; i <= 80; i++)
        {
            var proposal = tpe.Propose(history, new SearchSeeds(1).Proposal(0, i));
            proposals.Add(proposal);
            history.Observe(new TrialRecord { Id = i, Family = "f", Parameters = proposal.Parameters, Budget = 1, Proposer = proposal.Proposer, Created = ProposerRuns.Epoch });
            if (i > 3)
            {
                var finished = proposals[i - 4].Parameters;
                history.Observe(ProposerRuns.Done(i - 3, finished, Score(finished)));
            }
        }

        // Then every set is valid, the fixed values are exact, and the model found the preferred choice
        Assert.All(proposals, p => Assert.Empty(space.Problems(p.Parameters)));
        Assert.All(proposals, p => Assert.Equal((3.0, 6.0), (p.Parameters["seed_offset"], p.Parameters["depth"])));
        var modelled = proposals.Where(p => p.Proposer == "tpe").ToList();
        Assert.True(modelled.Count > 60);
        Assert.True(modelled.Count(p => p.Parameters["kind"] == 2) > modelled.Count / 2);
        Assert.Equal(3, history.Pending.Count);
    }

    [Fact]
    public void Fits_on_the_highest_budget_that_has_enough_results()
    {
        // Given 1-D results where the low budget favours x near 0.1 and the full budget favours x near 0.9
        var space = new ParameterSpace([ParameterRange.Linear("x", 0, 1)]);
        var history = new FamilyHistory("f", space);
        int id = 0;
        void Add(int budget, int count, double best)
        {
            for (int i = 0; i < count; i++)
            {
                double x = (i + 0.5) / count;
                history.Observe(ProposerRuns.Done(++id, ParameterSet.Of([new("x", x)]), Math.Abs(x - best), budget));
            }
        }

        Add(budget: 1, count: 40, best: 0.1);
        Add(budget: 9, count: 9, best: 0.9);
        var tpe = new TpeProposer(new TpeOptions(RandomStart: 10, Ladder: false));
        double Mean() => Enumerable.Range(0, 40).Average(s => tpe.Propose(history, new Random(s)).Parameters["x"]);

        // When the full budget has fewer than the ten results this model is set to need, proposals follow the low budget
        Assert.InRange(Mean(), 0.0, 0.3);

        // Then once it has ten, they follow the full budget
        Add(budget: 9, count: 1, best: 0.9);
        Assert.InRange(Mean(), 0.7, 1.0);
    }

    [Fact]
    public void On_the_ladder_ranks_candidates_promoted_further_first_whatever_they_scored_lower_down()
    {
        // Given 20 candidates at budget 1 where x near 0.1 scores best, and four candidates near 0.9 promoted to budget 9
        var space = new ParameterSpace([ParameterRange.Linear("x", 0, 1)]);
        TpeProposer Tpe(bool ladder) => new(new TpeOptions(RandomStart: 10, Ladder: ladder));
        var history = new FamilyHistory("f", space);
        var xs = Enumerable.Range(0, 20).Select(i => (i + 0.5) / 20).ToArray();
        for (int i = 0; i < xs.Length; i++)
        {
            history.Observe(ProposerRuns.Done(i + 1, ParameterSet.Of([new("x", xs[i])]), Math.Abs(xs[i] - 0.1)));
        }

        foreach (int parent in new[] { 17, 18, 19, 20 })
        {
            history.Observe(ProposerRuns.Done(history.Results + 1, ParameterSet.Of([new("x", xs[parent - 1])]), Math.Abs(xs[parent - 1] - 0.9), budget: 9) with { ParentId = parent });
        }

        double Mean(TpeProposer tpe) => Enumerable.Range(0, 40).Average(s => tpe.Propose(history, new Random(s)).Parameters["x"]);

        // Then the ladder's good share (5 of 20 candidates) is the four promoted ones and the best of the rest, so proposals go high,
        // while BOHB's rule, with fewer than ten results at budget 9, fits on budget 1 and proposes near 0.1
        Assert.InRange(Mean(Tpe(ladder: true)), 0.6, 1.0);
        Assert.InRange(Mean(Tpe(ladder: false)), 0.0, 0.3);
    }

    [Fact]
    public void With_the_good_share_taken_from_the_top_only_the_best_promoted_candidates_make_the_good_density()
    {
        // Given 20 candidates at budget 1 and ten promoted to budget 9: the two near x = 0.95 score best there, the
        // eight between 0.1 and 0.5 poorly
        var space = new ParameterSpace([ParameterRange.Linear("x", 0, 1)]);
        var history = new FamilyHistory("f", space);
        var xs = Enumerable.Range(0, 20).Select(i => (i + 0.5) / 20).ToArray();
        for (int i = 0; i < xs.Length; i++)
        {
            history.Observe(ProposerRuns.Done(i + 1, ParameterSet.Of([new("x", xs[i])]), 1.0));
        }

        foreach (int parent in new[] { 3, 4, 5, 6, 7, 8, 9, 10, 19, 20 })
        {
            double x = xs[parent - 1];
            history.Observe(ProposerRuns.Done(history.Results + 1, ParameterSet.Of([new("x", x)]), x > 0.9 ? 1 - x : 0.5 + x, budget: 9) with { ParentId = parent });
        }

        double Mean(TpeOptions options) => Enumerable.Range(0, 40).Average(s => new TpeProposer(options).Propose(history, new Random(s)).Parameters["x"]);

        // Then the ladder's good share (5 of 20 candidates) is the two best promoted and three poor ones, so proposals
        // spread over both groups, while the best fifth of the ten promoted (two) lie near 0.95 only
        double ladder = Mean(new TpeOptions(RandomStart: 10));
        double top = Mean(new TpeOptions(RandomStart: 10, GoodFromTop: 0.2));
        Assert.InRange(top, 0.75, 1.0);
        Assert.True(top > ladder + 0.1, $"good from the top {top:F3}, ladder {ladder:F3}");
    }

    [Fact]
    public void Steers_simultaneous_proposals_away_from_candidates_still_running()
    {
        // Given 30 results of a 1-D bowl at 0.5, and where TPE would propose next on its own
        var space = new ParameterSpace([ParameterRange.Linear("x", 0, 1)]);
        FamilyHistory Fresh()
        {
            var h = new FamilyHistory("f", space);
            for (int i = 0; i < 30; i++)
            {
                double x = (i + 0.5) / 30;
                h.Observe(ProposerRuns.Done(i + 1, ParameterSet.Of([new("x", x)]), (x - 0.5) * (x - 0.5)));
            }

            return h;
        }

        var tpe = new TpeProposer();
        var alone = Fresh();
        var crowded = Fresh();

        // When eight candidates at x = 0.5 are still running in one history (imputed with the worst score)
        for (int i = 0; i < 8; i++)
        {
            crowded.Observe(new TrialRecord { Id = 100 + i, Family = "f", Parameters = ParameterSet.Of([new("x", 0.5)]), Budget = 1, Proposer = "tpe", Created = ProposerRuns.Epoch, State = TrialState.Running });
        }

        // Then proposals land near 0.5 far less often there
        int Near(FamilyHistory h) => Enumerable.Range(0, 200).Count(s => Math.Abs(tpe.Propose(h, new Random(s)).Parameters["x"] - 0.5) < 0.02);
        int near = Near(alone), nearCrowded = Near(crowded);
        Assert.True(nearCrowded * 2 < near, $"near 0.5: {near} alone, {nearCrowded} with running candidates there");
    }

    [Fact]
    public void Does_better_on_Hartmann_six_with_joint_densities_than_with_independent_ones()
    {
        // Measured here, median best over 40 seeds (random search in brackets): at 20/30/50/100 evaluations joint
        // −1.961/−2.439/−2.848/−3.141, independent −1.906/−2.220/−2.735/−3.127 (−1.295/−1.406/−1.712/−1.961); on Branin
        // at 15/25/40/60 joint 1.256/0.658/0.498/0.441, independent 1.414/0.681/0.504/0.454. The widest gap is checked.
        double joint = ProposerRuns.MedianBest(new TpeProposer(new TpeOptions(Joint: true)), TestFunctions.HartmannSpace, TestFunctions.Hartmann, 30, 40);
        double independent = ProposerRuns.MedianBest(new TpeProposer(new TpeOptions(Joint: false)), TestFunctions.HartmannSpace, TestFunctions.Hartmann, 30, 40);

        Assert.True(joint < independent - 0.1, $"joint {joint:F3}, independent {independent:F3}");
    }

    [Fact]
    public void Is_repeatable_for_the_same_history_and_seed()
    {
        var first = ProposerRuns.Minimise(new TpeProposer(), TestFunctions.BraninSpace, TestFunctions.Branin, 30, seed: 4);
        var second = ProposerRuns.Minimise(new TpeProposer(), TestFunctions.BraninSpace, TestFunctions.Branin, 30, seed: 4);

        Assert.Equal(first.Proposed.ToArray(), second.Proposed.ToArray());
    }

    [Fact]
    public void Rejects_settings_outside_their_meaning()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => new TpeProposer(new TpeOptions(GoodFraction: 1)));
        Assert.Throws<ArgumentOutOfRangeException>(() => new TpeProposer(new TpeOptions(DrawsPerProposal: 0)));
        Assert.Throws<ArgumentOutOfRangeException>(() => new TpeProposer(new TpeOptions(RandomStart: 1)));
        Assert.Throws<ArgumentOutOfRangeException>(() => new TpeProposer(new TpeOptions(GoodFromTop: 0)));
        Assert.Throws<ArgumentOutOfRangeException>(() => new TpeProposer(new TpeOptions(GoodFromTop: 1)));
    }
}
