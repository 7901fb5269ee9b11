using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners.Tests;

/// <summary>What each family makes of a NaN cell, measured on a table where missing means something different from zero.</summary>
public sealed class MissingCellTests
{
    private const int Rows = 300;

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
    public void Each_family_learns_that_a_missing_cell_differs_from_zero(string family)
    {
        // Given the same table through the project's own path (LightGBM reads NaN, FastTree the imputed view with its flag)
        var (features, labels) = Cells();
        var column = Enumerable.Range(0, Rows).Where(r => features[r] != 0).ToArray();
        var table = new FeatureTable(
            "nan.csv", [.. Enumerable.Range(0, Rows).Select(r => $"r{r}")], ["x"],
            [new SparseColumn([.. column], [.. column.Select(r => features[r])])], [.. labels.Select(y => (double)y)]);
        var data = TrialData.From(table, table, new FoldPlan(2, 0, [.. Enumerable.Range(0, Rows).Select(r => r % 2)]), Metric.Rmse);
        var learner = family == FamilyNames.LightGbm ? (IFoldLearner)new LightGbmLearner() : new FastTreeLearner();
        var parameters = TinyTables.Parameters(family);

        // When one fold is fitted
        var prediction = learner.Fit(TinyTables.Job(data, family, parameters, budget: 100) with { Inputs = data.InputsFor(data.Folds.TrainRows(0), 7) }, CancellationToken.None);

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
