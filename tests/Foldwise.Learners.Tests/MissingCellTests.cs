using Foldwise.Core.Metrics;
using Foldwise.Core.Folds;
using Foldwise.Core.Data;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners.Tests;

/// <summary>
/// What ML.NET's trainers (5.0.1 and 6.0.0 alike) do with a NaN cell, pinned so that an upgrade that changes it shows here: FastForest,
/// GAM and SDCA train as if the cell were 0, but score it otherwise (forest: as a value above every split; GAM: as
/// a value in its lowest bin; SDCA: NaN); FastTree skips training rows that hold one. So these families read each
/// fold's median-imputed inputs with their "was missing" columns; LightGBM reads NaN as it is.
/// </summary>
public sealed class MissingCellTests
{
    private const int Rows = 300;

    [Fact]
    public void Forest_trains_a_missing_cell_as_zero_but_scores_it_as_a_large_value()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.FastForest(ForestLearner.Options(job)).Fit(train), FamilyNames.Forest);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(withMissing.Test[0] > withZero.Test[1] + 1, $"missing {withMissing.Test[0]:F3}, zero {withZero.Test[0]:F3}, x0 = 1 {withZero.Test[1]:F3}");
    }

    [Fact]
    public void Gam_trains_a_missing_cell_as_zero_but_scores_it_in_its_lowest_bin()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.Gam(GamLearner.Options(job)).Fit(train), FamilyNames.Gam);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(withMissing.Test[0] < withZero.Test[2] - 1, $"missing {withMissing.Test[0]:F3}, zero {withZero.Test[0]:F3}, x0 = −1 {withZero.Test[2]:F3}");
    }

    [Fact]
    public void Sdca_trains_a_missing_cell_as_zero_and_predicts_NaN_for_it()
    {
        var (withMissing, withZero) = Fits((ml, train, job) => ml.Regression.Trainers.Sdca(LinearLearner.Options(job)).Fit(train), FamilyNames.Linear);

        Assert.Equal(withZero.Test[1..], withMissing.Test[1..]);
        Assert.True(double.IsNaN(withMissing.Test[0]));
    }

    /// <summary>y = 3·x0 + x1 + noise; x0 is <paramref name="missing"/> in every third training row and in the first test row.</summary>
    private static TrialData Table(double missing)
    {
        var random = new Random(3);
        var train = new double[300][];
        var target = new double[300];
        for (int r = 0; r < train.Length; r++)
        {
            double x0 = (random.NextDouble() * 4) - 2;
            double x1 = (random.NextDouble() * 4) - 2;
            target[r] = (3 * x0) + x1 + (0.1 * random.NextDouble());
            train[r] = [r % 3 == 0 ? missing : x0, x1];
        }

        double[][] test = [[missing, 0.5], [1.0, 0.5], [-1.0, 0.5], [0, 0.5]];
        return DenseTables.Data(train, target, test, [.. Enumerable.Range(0, train.Length).Select(r => r % 3)]);
    }

    /// <summary>The same fit on the table with NaN cells and with zero cells, past the learners' own refusal.</summary>
    private static (FoldPrediction WithMissing, FoldPrediction WithZero) Fits(Func<MLContext, IDataView, FoldJob, ITransformer> train, string family)
    {
        FoldPrediction Fit(TrialData data)
        {
            var job = TinyTables.Job(data, family, budget: 50);
            return FoldFitter.Fit(family, FamilyInput.RawWithMissing, job, (ml, view) => train(ml, view, job), CancellationToken.None);
        }

        return (Fit(Table(double.NaN)), Fit(Table(0)));
    }

    [Fact]
    public void FastTree_in_MLNET_5_skips_training_rows_with_a_NaN_feature_and_scores_NaN_as_neither_zero_nor_its_rows()
    {
        // Given x = 0 → y = 0, x = NaN → y = 10, x = 5 → y = 5, fed to ML.NET 5 FastTree as it is (no imputation)
        var (features, labels) = Cells();
        var all = Enumerable.Range(0, Rows).ToArray();
        var withoutNaN = all.Where(r => !float.IsNaN(features[r])).ToArray();

        // When one model is fitted on every row and another on the rows without NaN, and both score x = 0, NaN, 5
        var scoresAll = FitAndScore(features, labels, all);
        var scoresWithout = FitAndScore(features, labels, withoutNaN);

        // Then the NaN rows changed nothing (they were skipped), and NaN scores like x = 5, far from its rows' 10
        Assert.Equal(scoresWithout, scoresAll);
        Assert.InRange(scoresAll[0], -0.5, 0.5);
        Assert.InRange(scoresAll[1], 4.5, 5.5);
        Assert.Equal(scoresAll[2], scoresAll[1]);
    }

    private static float[] FitAndScore(float[] features, float[] labels, int[] rows)
    {
        var ml = new MLContext(seed: 1);
        var view = ml.Data.LoadFromEnumerable(rows.Select(r => new DenseRow { Label = labels[r], Features = [features[r]] }));
        var model = ml.Regression.Trainers.FastTree(new Microsoft.ML.Trainers.FastTree.FastTreeRegressionTrainer.Options
        {
            NumberOfTrees = 50, NumberOfLeaves = 4, MinimumExampleCountPerLeaf = 5, NumberOfThreads = 1,
        }).Fit(view);
        var probe = ml.Data.LoadFromEnumerable(new[] { 0f, float.NaN, 5f }.Select(x => new DenseRow { Features = [x] }));
        return model.Transform(probe).GetColumn<float>("Score").ToArray();
    }

    [Theory]
    [InlineData(FamilyNames.LightGbm)]
    [InlineData(FamilyNames.FastTree)]
    [InlineData(FamilyNames.Forest)]
    [InlineData(FamilyNames.Gam)]
    public void Each_family_learns_that_a_missing_cell_differs_from_zero(string family)
    {
        // Given the same table through the project's own path (LightGBM reads NaN, the others the imputed view with its flag)
        var (features, labels) = Cells();
        var column = Enumerable.Range(0, Rows).Where(r => features[r] != 0).ToArray();
        var table = new FeatureTable(
            "nan.csv", [.. Enumerable.Range(0, Rows).Select(r => $"r{r}")], ["x"],
            [new SparseColumn([.. column], [.. column.Select(r => features[r])])], [.. labels.Select(y => (double)y)]);
        var data = TrialData.From(table, table, new FoldPlan(2, 0, [.. Enumerable.Range(0, Rows).Select(r => r % 2)]), Metric.Rmse);
        var learner = LearnerCatalog.BuiltIn.Get(family);
        var inputs = data.InputsFor(fold: 0, family);
        var parameters = TinyTables.Parameters(family, features: inputs.ColumnCount);

        // When one fold is fitted
        var prediction = learner.Fit(TinyTables.Job(data, family, parameters, budget: 100) with { Inputs = inputs }, CancellationToken.None);

        // Then rows with a missing x are predicted near 10 and rows with x = 0 near 0
        Assert.InRange(prediction.Test[1], 9, 11);
        Assert.InRange(prediction.Test[0], -1, 1);
    }

    private static (float[] Features, float[] Labels) Cells()
    {
        var features = new float[Rows];
        var labels = new float[Rows];
        for (int r = 0; r < Rows; r++)
        {
            (features[r], labels[r]) = (r % 3) switch { 0 => (0f, 0f), 1 => (float.NaN, 10f), _ => (5f, 5f) };
        }

        return (features, labels);
    }

    private sealed class DenseRow
    {
        public float Label { get; set; }

        [VectorType(1)]
        public float[] Features { get; set; } = [];
    }
}
