using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

namespace Foldwise.Learners.Tests;

public sealed class NativeLightGbmTests
{
    private static readonly TrialData Data = TinyTables.Data(rows: 400, testRows: 150);

    [Theory]
    [InlineData(1.0, 1.0)]
    [InlineData(0.7, 0.6)]
    public void Predicts_what_the_MLNET_trainer_predicts_for_the_same_parameters_and_seed(double rowFraction, double featureFraction)
    {
        // Given a job that subsamples rows and features, so the seed matters
        var parameters = new ParameterSet(TinyTables.Parameters(FamilyNames.LightGbm, rowFraction).Values.SetItem("feature_fraction", featureFraction));
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, parameters, seed: 5, budget: 80);

        // When the native learner and ML.NET's trainer fit it
        var native = new LightGbmLearner().Fit(job, CancellationToken.None);
        var reference = new MlNetLightGbmLearner().Fit(job, CancellationToken.None);

        // Then they agree to ML.NET's precision: both train in the same native library with the same settings, and ML.NET
        // returns scores as floats (about 7 significant digits); the largest gap seen was 3e-9
        Assert.Equal(reference.Validation.Length, native.Validation.Length);
        AssertClose(reference.Validation, native.Validation);
        AssertClose(reference.Test, native.Test);
    }

    [Fact]
    public void Continues_a_model_to_the_same_predictions_as_one_longer_fit()
    {
        // Given a subsampling job fitted for 30 rounds, and the same job fitted for 70
        var parameters = TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.7);
        using var shorter = LightGbmFoldModel.Train(TinyTables.Job(Data, FamilyNames.LightGbm, parameters, budget: 30), scoreEachRound: false, CancellationToken.None);
        using var longer = LightGbmFoldModel.Train(TinyTables.Job(Data, FamilyNames.LightGbm, parameters, budget: 70), scoreEachRound: false, CancellationToken.None);
        var at30 = shorter.Predict();

        // When the short one is continued for 40 more rounds
        shorter.Continue(40, CancellationToken.None);

        // Then it is the longer model to the bit, and its first 30 rounds still predict as before
        Assert.Equal(70, shorter.Rounds);
        Assert.Equal(longer.Predict().Test, shorter.Predict().Test);
        Assert.Equal(at30.Validation, shorter.Predict(rounds: 30).Validation);
    }

    [Fact]
    public void Continues_at_a_changed_learning_rate()
    {
        // Given two 20-round models of the same job
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, budget: 20);
        using var same = LightGbmFoldModel.Train(job, scoreEachRound: false, CancellationToken.None);
        using var slower = LightGbmFoldModel.Train(job, scoreEachRound: false, CancellationToken.None);

        // When one continues at the job's rate and the other at a tenth of it
        same.Continue(20, CancellationToken.None);
        slower.ChangeLearningRate(0.01);
        slower.Continue(20, CancellationToken.None);

        // Then their first 20 rounds agree and the later rounds differ
        Assert.Equal(same.Predict(rounds: 20).Test, slower.Predict(rounds: 20).Test);
        Assert.NotEqual(same.Predict().Test, slower.Predict().Test);
    }

    [Fact]
    public void Scores_the_held_out_rows_after_every_round()
    {
        // Given a job of 50 rounds, fitted with a score per round
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, budget: 50);
        using var model = LightGbmFoldModel.Train(job, scoreEachRound: true, CancellationToken.None);
        var actual = job.ValidationRows.Select(r => Data.Target[r]).ToArray();

        // When its predictions at 10 and at 50 rounds are scored
        double at10 = Data.Metric.Score(actual, model.Predict(rounds: 10).Validation);
        double at50 = Data.Metric.Score(actual, model.Predict().Validation);

        // Then the per-round scores hold the same values at those rounds, and the fit improved along the way
        Assert.Equal(50, model.ValidationScores.Count);
        Assert.Equal(at10, model.ValidationScores[9], 9);
        Assert.Equal(at50, model.ValidationScores[49], 9);
        Assert.True(model.ValidationScores[49] < model.ValidationScores[0]);
    }

    [Fact]
    public void Keeps_no_scores_per_round_unless_asked()
    {
        using var model = LightGbmFoldModel.Train(TinyTables.Job(Data, FamilyNames.LightGbm, budget: 5), scoreEachRound: false, CancellationToken.None);

        Assert.Empty(model.ValidationScores);
    }

    [Fact]
    public void Treats_a_NaN_cell_as_missing_and_an_absent_cell_as_zero()
    {
        // Given a column that is NaN in a third of the rows (target 10), absent (zero) in a third (target 0) and 1 in a third (target 5)
        var data = MissingCells.Data(rows: 300);
        var job = new FoldJob(data, 0, data.Folds.TrainRows(0), data.Folds.ValidationRows(0), TinyTables.Parameters(FamilyNames.LightGbm), 50, 3, 1);

        // When it is fitted
        var prediction = new LightGbmLearner().Fit(job, CancellationToken.None);

        // Then each kind of cell gets its own prediction: zero is not lumped with missing
        var validation = job.ValidationRows;
        for (int i = 0; i < validation.Length; i++)
        {
            Assert.Equal(MissingCells.Target(validation[i]), prediction.Validation[i], 0.5);
        }
    }

    [Fact]
    public void Names_the_parameter_LightGBM_refuses()
    {
        // Given a Dataset of a fold's rows
        var job = TinyTables.Job(Data, FamilyNames.LightGbm);
        var inputs = NativeFoldRows.From(job);
        using var rows = inputs.CopyTrain();
        using var train = LightGbmDataset.FromRows(rows, inputs.Labels(), LightGbmParameters.For(job), reference: null, "the training rows");

        // When a booster is asked for with a leaf count LightGBM cannot use
        var error = Assert.Throws<LightGbmException>(() => LightGbmBooster.Create(train, "objective=regression num_leaves=1 num_threads=1 verbosity=-1"));

        // Then the error names the parameters and LightGBM's reason, which names the parameter
        Assert.Contains("num_leaves=1", error.Message);
        Assert.Contains("num_leaves", error.Message[(error.Message.IndexOf(':', StringComparison.Ordinal) + 1)..]);
    }

    [Fact]
    public void Refuses_to_predict_once_disposed()
    {
        var model = LightGbmFoldModel.Train(TinyTables.Job(Data, FamilyNames.LightGbm, budget: 3), scoreEachRound: false, CancellationToken.None);

        model.Dispose();

        Assert.Throws<ObjectDisposedException>(() => model.Predict());
    }

    [Fact]
    public void Trains_no_further_round_once_cancelled()
    {
        // Given a model of 5 rounds and a cancelled token
        using var model = LightGbmFoldModel.Train(TinyTables.Job(Data, FamilyNames.LightGbm, budget: 5), scoreEachRound: false, CancellationToken.None);
        using var cancel = new CancellationTokenSource();
        cancel.Cancel();

        // When it is asked for many more rounds, then it stops before the next round and keeps its 5
        Assert.ThrowsAny<OperationCanceledException>(() => model.Continue(100_000, cancel.Token));
        Assert.Equal(5, model.Rounds);
    }

    [Fact]
    public void Runs_fits_side_by_side_in_one_process_with_the_same_results_as_one_by_one()
    {
        // Given four different jobs
        var jobs = Enumerable.Range(0, 4).Select(s => TinyTables.Job(Data, FamilyNames.LightGbm, TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.8), seed: s, budget: 60)).ToArray();
        var learner = new LightGbmLearner();
        var oneByOne = jobs.Select(j => learner.Fit(j, CancellationToken.None)).ToArray();

        // When they are fitted at the same time on four threads
        var sideBySide = new FoldPrediction[jobs.Length];
        Parallel.For(0, jobs.Length, new ParallelOptions { MaxDegreeOfParallelism = jobs.Length }, i => sideBySide[i] = learner.Fit(jobs[i], CancellationToken.None));

        // Then every prediction is the same to the bit
        for (int i = 0; i < jobs.Length; i++)
        {
            Assert.Equal(oneByOne[i].Validation, sideBySide[i].Validation);
            Assert.Equal(oneByOne[i].Test, sideBySide[i].Test);
        }
    }

    [Fact]
    public void Builds_feature_by_feature_histograms_that_predict_what_row_by_row_ones_predict()
    {
        // Given a fold's Dataset and the job's parameters, which ask for histograms feature by feature
        var job = TinyTables.Job(Data, FamilyNames.LightGbm, TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.7), seed: 3, budget: 40);
        string parameters = LightGbmParameters.For(job);
        Assert.Contains("force_col_wise=true", parameters);
        var inputs = NativeFoldRows.From(job);
        using var rows = inputs.CopyTrain();
        using var held = inputs.CopyValidation();

        // When one booster trains with them and another with histograms row by row instead
        double[] Predictions(string settings)
        {
            using var train = LightGbmDataset.FromRows(rows, inputs.Labels(), LightGbmParameters.ForDataset(job), reference: null, "the training rows");
            using var booster = LightGbmBooster.Create(train.Borrow(), settings);
            for (int i = 0; i < job.Budget; i++)
            {
                booster.TrainOneRound();
            }

            return booster.Predict(held, 0, job.Threads, "the held-out rows");
        }

        // Then at one thread they predict the same to the bit
        Assert.Equal(Predictions(parameters), Predictions(parameters.Replace("force_col_wise=true", "force_row_wise=true", StringComparison.Ordinal)));
    }

    [Fact]
    public void Copies_a_fold_s_rows_cell_for_cell_in_the_fold_s_order()
    {
        // Given a fold's held-out rows
        var job = TinyTables.Job(Data, FamilyNames.LightGbm);
        var matrix = job.Features.Train;

        // When they are copied for LightGBM
        using var rows = NativeFoldRows.From(job).CopyValidation();

        // Then each copied row holds the table row's columns and values, in the fold's order
        Assert.Equal(job.ValidationRows.Length, rows.RowCount);
        Assert.Equal(CsrRows.Cells(matrix, job.ValidationRows), rows.CellCount);
        for (int i = 0; i < rows.RowCount; i++)
        {
            Assert.Equal(matrix.RowColumns(job.ValidationRows[i]).ToArray(), rows.RowColumns(i).ToArray());
            Assert.Equal(matrix.RowValues(job.ValidationRows[i]).ToArray(), rows.RowValues(i).ToArray());
        }
    }

    private static void AssertClose(double[] expected, double[] actual)
    {
        for (int i = 0; i < expected.Length; i++)
        {
            Assert.True(Math.Abs(expected[i] - actual[i]) <= 1e-6 * Math.Max(1, Math.Abs(expected[i])), $"row {i}: ML.NET {expected[i]:R}, native {actual[i]:R}");
        }
    }
}
