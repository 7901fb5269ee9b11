using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;

namespace Foldwise.Core.Tests.Learning;

public sealed class RoundByRoundTrialTests
{
    private static readonly TrialData Data = TinyTables.RampTrialData();

    /// <summary>Best after 30 rounds (error 0.01), worse on either side.</summary>
    private static double BestAt30(int rounds) => 0.01 + (Math.Abs(rounds - 30) / 100.0);

    private static TrialOutcome Run(IFoldLearner learner, int budget, bool predictsTest = true, RoundStopping? stopping = null) =>
        new TrialExecutor(learner, stopping ?? RoundStopping.Default).Run(Data, ParameterSet.Of([]), budget, seed: 1, threads: 1, CancellationToken.None, predictsTest: predictsTest);

    [Fact]
    public void A_trial_keeps_its_best_round_and_predicts_with_it()
    {
        // Given folds whose pooled held-out score is best after 30 rounds
        var learner = new CurveLearner(BestAt30);

        // When a trial of 100 rounds runs
        var outcome = Run(learner, budget: 100);

        // Then it stops 10 rounds (its patience) after round 30, keeps round 30, and every fold predicts from 30 rounds
        Assert.Equal(30, outcome.BestRound);
        Assert.Equal(40, outcome.RoundsTrained);
        Assert.Equal(0.01, outcome.Score, 12);
        Assert.All(learner.Fits, fit => Assert.Equal([(30, true)], fit.Predictions));
        Assert.All(outcome.Test, t => Assert.Equal(0.01, t, 12));
        Assert.All(learner.Fits, fit => Assert.True(fit.Disposed));
    }

    [Fact]
    public void A_short_trial_still_improving_keeps_its_whole_budget()
    {
        // Given the same folds and a trial of 20 rounds, before their best
        var learner = new CurveLearner(BestAt30);

        // When it runs
        var outcome = Run(learner, budget: 20);

        // Then it trains and keeps all 20 rounds
        Assert.Equal(20, outcome.BestRound);
        Assert.Equal(20, outcome.RoundsTrained);
        Assert.Equal(0.11, outcome.Score, 12);
    }

    [Fact]
    public void A_flat_score_keeps_the_first_round_and_stops_after_the_patience()
    {
        // Given folds whose score never changes
        var learner = new CurveLearner(_ => 0.2);

        // When a trial of 100 rounds runs
        var outcome = Run(learner, budget: 100);

        // Then no later round beats the first: it keeps round 1 and stops at round 11
        Assert.Equal(1, outcome.BestRound);
        Assert.Equal(11, outcome.RoundsTrained);
    }

    [Fact]
    public void A_model_that_can_split_no_more_ends_the_trial_there()
    {
        // Given folds that can grow only 12 rounds, still improving
        var learner = new CurveLearner(BestAt30, splitsUntil: 12);

        // When a trial of 100 rounds runs
        var outcome = Run(learner, budget: 100);

        // Then it ends at round 12 and keeps it
        Assert.Equal(12, outcome.BestRound);
        Assert.Equal(12, outcome.RoundsTrained);
    }

    [Fact]
    public void Below_the_full_budget_the_test_table_is_not_predicted()
    {
        // Given a trial told not to predict the test table
        var learner = new CurveLearner(BestAt30);

        // When it runs
        var outcome = Run(learner, budget: 20, predictsTest: false);

        // Then no fold predicted it and the outcome's test vector is empty, while the held-out rows are all predicted
        Assert.All(learner.Fits, fit => Assert.Equal([(20, false)], fit.Predictions));
        Assert.Empty(outcome.Test);
        Assert.Equal(Data.Train.RowCount, outcome.OutOfFold.Length);
    }

    [Fact]
    public void Without_stopping_a_trial_trains_its_whole_budget_and_keeps_no_round()
    {
        // Given the same folds and an executor without a stopping rule
        var learner = new CurveLearner(BestAt30);

        // When a trial of 100 rounds runs
        var outcome = new TrialExecutor(learner, stopping: null).Run(Data, ParameterSet.Of([]), 100, seed: 1, threads: 1, CancellationToken.None);

        // Then each fold is fitted whole, to the budget
        Assert.Equal(5, learner.WholeFits);
        Assert.Null(outcome.BestRound);
        Assert.Equal(100, outcome.RoundsTrained);
        Assert.Equal(0.71, outcome.Score, 12);
    }

    [Fact]
    public void Each_fold_prepared_and_each_round_trained_on_every_fold_is_told_as_it_ends()
    {
        // Given folds whose best is after 30 rounds and a trial of 100 rounds that is told how far it has come
        var learner = new CurveLearner(BestAt30);
        var told = new List<(int FoldsReady, int Round)>();

        // When it runs
        new TrialExecutor(learner, RoundStopping.Default).Run(
            Data, ParameterSet.Of([]), 100, seed: 1, threads: 1, CancellationToken.None, advanced: (ready, round) => told.Add((ready, round)));

        // Then it was told the 5 folds prepared one by one, then rounds 1 to 40 in order, where it stopped
        Assert.Equal([.. Enumerable.Range(1, 5).Select(f => (f, 0)), .. Enumerable.Range(1, 40).Select(r => (5, r))], told);
    }

    [Theory]
    [InlineData(true)]
    [InlineData(false)]
    public void A_trial_on_the_first_folds_trains_only_those_and_is_scored_on_their_held_out_rows(bool roundByRound)
    {
        // Given folds whose every held-out prediction is off by 0.01 after 30 rounds (the rows outside them would be off by their whole target)
        var learner = new CurveLearner(BestAt30);
        var executor = new TrialExecutor(learner, roundByRound ? RoundStopping.Default : null);

        // When a trial of 30 rounds runs on the plan's first 2 of 5 folds
        var outcome = executor.Run(Data, ParameterSet.Of([]), 30, seed: 1, threads: 1, CancellationToken.None, folds: 2);

        // Then 2 folds trained, each with its own score, and the pooled score covers their rows alone
        Assert.Equal(2, roundByRound ? learner.Fits.Count : learner.WholeFits);
        Assert.Equal(2, outcome.FoldScores.Length);
        Assert.Equal(0.01, outcome.Score, 12);
        var covered = Data.Folds.ValidationRows(0).Concat(Data.Folds.ValidationRows(1)).ToHashSet();
        Assert.All(Enumerable.Range(0, Data.Train.RowCount).Where(r => !covered.Contains(r)), r => Assert.Equal(0, outcome.OutOfFold[r]));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(6)]
    public void A_fold_count_outside_the_plan_is_refused(int folds)
    {
        var executor = new TrialExecutor(new CurveLearner(BestAt30));
        var error = Assert.Throws<ArgumentOutOfRangeException>(() => executor.Run(Data, ParameterSet.Of([]), 30, seed: 1, threads: 1, CancellationToken.None, folds: folds));
        Assert.Contains("must be 1 to the plan's 5 folds", error.Message, StringComparison.Ordinal);
    }
}
