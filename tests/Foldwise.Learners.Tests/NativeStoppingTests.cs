using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

namespace Foldwise.Learners.Tests;

public sealed class NativeStoppingTests
{
    private static readonly TrialData Data = TinyTables.Data(rows: 300, testRows: 60, folds: 3);

    /// <summary>Large steps on a small table: the held-out score turns worse well before 200 rounds.</summary>
    private static ParameterSet Overfitting => new(TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.8).Values
        .SetItem("learning_rate", 0.5).SetItem("leaves", 31).SetItem("min_leaf_rows", 2).SetItem("l2", 0.0));

    [Fact]
    public void A_trial_that_stops_at_its_best_round_is_the_trial_of_that_many_rounds()
    {
        // Given a trial of 200 rounds that overfits
        var learner = new LightGbmLearner();
        var stopped = new TrialExecutor(learner).Run(Data, Overfitting, budget: 200, seed: 4, threads: 1, CancellationToken.None);

        // When the same trial runs its best round count whole, without stopping
        int best = stopped.BestRound!.Value;
        var whole = new TrialExecutor(learner, stopping: null).Run(Data, Overfitting, budget: best, seed: 4, threads: 1, CancellationToken.None);

        // Then it stopped early, and its scores and predictions are those of the shorter trial (trees of a longer fit
        // are the shorter fit's trees, so only summation order may differ)
        Assert.InRange(best, 1, 199);
        Assert.True(stopped.RoundsTrained < 200, $"trained {stopped.RoundsTrained} rounds");
        Assert.Equal(whole.Score, stopped.Score, 9);
        Assert.Equal(whole.Test, stopped.Test, (a, b) => Math.Abs(a - b) < 1e-9);
    }

    [Fact]
    public void A_fold_model_round_by_round_sees_what_its_predictions_of_those_rounds_give()
    {
        // Given a fold model started with no rounds
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.8), budget: 30);
        using var model = LightGbmFoldModel.Start(job, scoreEachRound: false, CancellationToken.None);

        // When it trains 12 rounds one at a time
        for (int i = 0; i < 12; i++)
        {
            Assert.True(model.TrainRound());
        }

        // Then its running held-out predictions are those of predicting from its 12 rounds
        Assert.Equal(12, model.Rounds);
        Assert.Equal(model.Predict(12, withTest: false).Validation, model.HeldOutPredictions(), (a, b) => Math.Abs(a - b) < 1e-9);
    }

    [Fact]
    public void A_fit_not_asked_for_test_predictions_skips_the_test_table()
    {
        // Given a job that does not want the test table predicted
        var job = TinyTables.Job(Data, FamilyNames.LightGbm) with { PredictsTest = false };

        // When it is fitted
        var prediction = new LightGbmLearner().Fit(job, CancellationToken.None);

        // Then the held-out rows are predicted and the test table is not
        Assert.Equal(job.ValidationRows.Length, prediction.Validation.Length);
        Assert.Empty(prediction.Test);
    }

    [Fact]
    public void An_ML_NET_fit_not_asked_for_test_predictions_skips_the_test_table()
    {
        var job = TinyTables.Job(Data, FamilyNames.FastTree, budget: 10) with { PredictsTest = false };

        var prediction = new FastTreeLearner().Fit(job, CancellationToken.None);

        Assert.Equal(job.ValidationRows.Length, prediction.Validation.Length);
        Assert.Empty(prediction.Test);
    }
}
