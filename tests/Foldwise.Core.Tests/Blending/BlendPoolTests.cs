using Foldwise.Core.Blending;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Blending;

public sealed class BlendPoolTests
{
    private static readonly DateTimeOffset Created = new(2026, 12, 1, 9, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Keeps_the_best_full_budget_trials_of_each_family_best_first_ties_by_id()
    {
        // Given two families with done, failed, running and partial-budget trials
        TrialRecord[] trials =
        [
            Trial(1, "lightgbm", 600, TrialState.Done, 0.82),
            Trial(2, "lightgbm", 600, TrialState.Done, 0.80),
            Trial(3, "lightgbm", 200, TrialState.Done, 0.70),
            Trial(4, "lightgbm", 600, TrialState.Failed, null),
            Trial(5, "lightgbm", 600, TrialState.Done, 0.80),
            Trial(6, "lightgbm", 600, TrialState.Done, 0.81),
            Trial(7, "fasttree", 600, TrialState.Running, null),
            Trial(8, "fasttree", 600, TrialState.Done, 0.90),
            Trial(9, "fasttree", 600, TrialState.Done, 0.85),
        ];

        // When
        var pool = BlendPool.Select(trials, perFamily: 3, fullBudget: 600);

        // Then families in name order; within one, lower score first and the lower id on a tie
        Assert.Equal([9, 8, 2, 5, 6], pool.Select(t => t.Id));
    }

    [Fact]
    public void Leaves_out_a_trial_screened_on_some_folds_however_well_it_scored()
    {
        // Given a fold screen's trial on 1 fold that scored best, and its promotion on every fold
        var pool = BlendPool.Select([Trial(1, "lightgbm", 600, TrialState.Done, 0.10) with { Folds = 1 }, Trial(2, "lightgbm", 600, TrialState.Done, 0.80)], 3, 600);

        // Then only the trial on every fold can be pooled: the other's out-of-fold vector covers one fold's rows
        Assert.Equal([2], pool.Select(t => t.Id));
        Assert.Equal(0.80, SearchProgress.BestOf(pool)["lightgbm"]);
        Assert.Equal(0.80, SearchProgress.BestOf([Trial(1, "lightgbm", 600, TrialState.Done, 0.10) with { Folds = 1 }, Trial(2, "lightgbm", 600, TrialState.Done, 0.80)])["lightgbm"]);
    }

    [Fact]
    public void Leaves_out_a_done_trial_without_a_score()
    {
        var pool = BlendPool.Select([Trial(1, "lightgbm", 600, TrialState.Done, null)], 3, 600);

        Assert.Empty(pool);
    }

    [Fact]
    public void Rejects_a_pool_size_below_one()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => BlendPool.Select([], 0, 600));
    }

    private static TrialRecord Trial(int id, string family, int budget, TrialState state, double? score) => new()
    {
        Id = id,
        Family = family,
        Parameters = ParameterSet.Empty,
        Budget = budget,
        Proposer = "random",
        Created = Created,
        State = state,
        Score = score,
    };
}
