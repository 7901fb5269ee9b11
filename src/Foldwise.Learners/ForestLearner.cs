using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Trainers.FastTree;

namespace Foldwise.Learners;

/// <summary>
/// ML.NET's FastForest regression (a random forest), budget = trees. Every tree fits its own seeded sample of
/// <c>row_fraction</c> of the rows; the prediction is the trees' mean.
/// Reads the fold's median-imputed inputs: ML.NET trains a NaN cell as 0 but scores it otherwise (MissingCellTests).
/// </summary>
public sealed class ForestLearner : IFoldLearner, IKeepsModels
{
    internal static readonly OptionTable<FastForestRegressionTrainer.Options> Table = new(
        new Dictionary<string, Action<FastForestRegressionTrainer.Options, double>>
        {
            ["leaves"] = (o, v) => o.NumberOfLeaves = (int)v,
            ["min_leaf_rows"] = (o, v) => o.MinimumExampleCountPerLeaf = (int)v,
            ["feature_fraction"] = (o, v) => o.FeatureFraction = v,
            ["row_fraction"] = (o, v) => o.BaggingExampleFraction = v,
        });

    public string Family => FamilyNames.Forest;

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        // FastForest trains a NaN cell as 0 but scores it above every split (MissingCellTests): it reads imputed inputs.
        return FoldFitter.Fit(Family, job, (ml, train) => ml.Regression.Trainers.FastForest(Options(job)).Fit(train), cancellation);
    }

    public KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.FitAndKeep(Family, job, (ml, train) => ml.Regression.Trainers.FastForest(Options(job)).Fit(train), cancellation);

    public double[] PredictKept(FoldJob job, byte[] model) => FoldFitter.PredictKept(Family, job, model);

    internal static FastForestRegressionTrainer.Options Options(FoldJob job)
    {
        var options = new FastForestRegressionTrainer.Options
        {
            LabelColumnName = nameof(SparseFeatureRow.Label),
            FeatureColumnName = nameof(SparseFeatureRow.Features),
            NumberOfTrees = job.Budget,
            NumberOfThreads = job.Threads,
            Seed = job.Seed,
            DiskTranspose = false,

            // A fresh row sample for every tree.
            BaggingSize = 1,
        };
        Table.Apply(job.Parameters, options);
        return options;
    }
}
