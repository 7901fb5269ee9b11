using Foldwise.Core.Proposers;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

public sealed class FamilyHistoryTests
{
    private static readonly ParameterSpace Space = new([ParameterRange.Linear("x", 0, 1), ParameterRange.OneOf("c", "a", "b")]);

    private static TrialRecord Trial(int id, TrialState state, double? score = null, int? parent = null, int budget = 1, int folds = 0) => new()
    {
        Id = id,
        Family = "f",
        Parameters = ParameterSet.Of([new("x", id / 10.0), new("c", 1)]),
        Budget = budget,
        Folds = folds,
        ParentId = parent,
        Proposer = parent is null ? "tpe" : "promotion",
        Created = ProposerRuns.Epoch,
        State = state,
        Score = score,
    };

    [Fact]
    public void Keeps_new_candidates_pending_until_they_finish_and_results_by_budget()
    {
        var history = new FamilyHistory("f", Space);

        // When two new candidates and one promotion are created, and run
        history.Observe(Trial(1, TrialState.Queued));
        history.Observe(Trial(2, TrialState.Queued));
        history.Observe(Trial(3, TrialState.Queued, parent: 1, budget: 3));
        history.Observe(Trial(1, TrialState.Running));
        Assert.Equal(2, history.Pending.Count);
        Assert.Equal(2, history.NewCandidates);

        // Then a result leaves the pending set and lands at its budget; a failure leaves with no result
        history.Observe(Trial(1, TrialState.Done, 0.5));
        history.Observe(Trial(2, TrialState.Failed));
        history.Observe(Trial(3, TrialState.Done, 0.4, parent: 1, budget: 3));
        Assert.Empty(history.Pending);
        Assert.Equal([TrialReach.Whole(1), TrialReach.Whole(3)], history.Budgets);
        var result = Assert.Single(history.ResultsAt(1));
        Assert.Equal((1, 0.5), (result.TrialId, result.Score));
        Assert.Equal([0.1, 1.0], result.Values);
        Assert.Empty(history.ResultsAt(9));
    }

    [Fact]
    public void Follows_each_candidate_up_its_promotions_to_the_highest_budget_it_has_a_result_at()
    {
        var history = new FamilyHistory("f", Space);

        // Given candidate 1 promoted twice (1 → 3 → 5), candidate 2 stopped at the first budget, candidate 4 still running
        history.Observe(Trial(1, TrialState.Done, 0.5));
        history.Observe(Trial(2, TrialState.Done, 0.6));
        history.Observe(Trial(3, TrialState.Done, 0.4, parent: 1, budget: 3));
        history.Observe(Trial(4, TrialState.Running));
        history.Observe(Trial(5, TrialState.Done, 0.3, parent: 3, budget: 9));

        // Then each finished candidate appears once, under the trial that started it, at its furthest budget
        Assert.Equal(1, history.CandidateOf(5));
        Assert.Equal(4, history.Results);
        var furthest = history.Furthest.OrderBy(f => f.Result.TrialId).Select(f => (f.Result.TrialId, f.Reach.Budget, f.Result.Score)).ToList();
        Assert.Equal([(1, 9, 0.3), (2, 1, 0.6)], furthest);
    }

    [Fact]
    public void Counts_a_record_seen_twice_once_and_ignores_scores_that_are_not_finite()
    {
        var history = new FamilyHistory("f", Space);

        var created = history.Observe(Trial(1, TrialState.Done, 0.5));
        var again = history.Observe(Trial(1, TrialState.Done, 0.5));
        history.Observe(Trial(2, TrialState.Done, double.NaN));

        Assert.Equal(new TrialChange(Created: true, Finished: true), created);
        Assert.Equal(TrialChange.None, again);
        Assert.Single(history.ResultsAt(1));
        Assert.Equal(2, history.NewCandidates);
    }

    [Fact]
    public void Under_a_fold_screen_a_candidate_on_every_fold_is_further_than_one_on_its_first_fold_at_the_same_budget()
    {
        var history = new FamilyHistory("f", Space);

        // Given candidate 1 screened on one fold and promoted to all five, candidate 2 screened only
        history.Observe(Trial(1, TrialState.Done, 0.30, budget: 180, folds: 1));
        history.Observe(Trial(2, TrialState.Done, 0.20, budget: 180, folds: 1));
        history.Observe(Trial(3, TrialState.Done, 0.40, parent: 1, budget: 180));

        // Then candidate 1 stands at its whole-fold result and the two kinds of score are kept apart
        var furthest = history.Furthest.OrderBy(f => f.Result.TrialId).Select(f => (f.Result.TrialId, f.Reach, f.Result.Score)).ToList();
        Assert.Equal([(1, TrialReach.Whole(180), 0.40), (2, new TrialReach(180, 1), 0.20)], furthest);
        Assert.Equal(2, history.ResultsAt(new TrialReach(180, 1)).Count);
        Assert.Single(history.ResultsAt(180));
    }
}
