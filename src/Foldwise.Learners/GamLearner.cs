using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Trainers.FastTree;

namespace Foldwise.Learners;

/// <summary>
/// ML.NET's generalized additive model regression, budget = boosting iterations: the prediction is a sum of one
/// step function per feature, each boosted from single-feature trees.
/// Reads the fold's median-imputed inputs: ML.NET trains a NaN cell as 0 but scores it otherwise (MissingCellTests).
/// </summary>
public sealed class GamLearner : IFoldLearner, IKeepsModels
{
    internal static readonly OptionTable<GamRegressionTrainer.Options> Table = new(
        new Dictionary<string, Action<GamRegressionTrainer.Options, double>>
        {
            ["learning_rate"] = (o, v) => o.LearningRate = v,
            ["min_leaf_rows"] = (o, v) => o.MinimumExampleCountPerLeaf = (int)v,
            ["bins"] = (o, v) => o.MaximumBinCountPerFeature = (int)v,
        });

    public string Family => FamilyNames.Gam;

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        // GAM trains a NaN cell as 0 but scores it in its lowest bin (MissingCellTests): it reads imputed inputs.
        return FoldFitter.Fit(Family, job, (ml, train) => ml.Regression.Trainers.Gam(Options(job)).Fit(train), cancellation);
    }

    public KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.FitAndKeep(Family, job, (ml, train) => ml.Regression.Trainers.Gam(Options(job)).Fit(train), cancellation);

    public double[] PredictKept(FoldJob job, byte[] model) => FoldFitter.PredictKept(Family, job, model);

    internal static GamRegressionTrainer.Options Options(FoldJob job)
    {
        var options = new GamRegressionTrainer.Options
        {
            LabelColumnName = nameof(SparseFeatureRow.Label),
            FeatureColumnName = nameof(SparseFeatureRow.Features),
            NumberOfIterations = job.Budget,
            NumberOfThreads = job.Threads,
            Seed = job.Seed,
            DiskTranspose = false,

            // Pruning needs a validation set, which a fold fit does not pass.
            EnablePruning = false,
        };
        Table.Apply(job.Parameters, options);
        return options;
    }
}
