using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Trainers.LightGbm;

namespace Foldwise.Learners;

/// <summary>
/// ML.NET's LightGBM regression trainer, budget = boosting rounds: the reference the native <see cref="LightGbmLearner"/>
/// is checked against (same native library, same parameters and seed) and the bench's former default. Not in the
/// catalog: ML.NET trains one LightGBM model per process at a time.
/// </summary>
public sealed class MlNetLightGbmLearner : IFoldLearner
{
    internal static readonly OptionTable<LightGbmRegressionTrainer.Options> Table = new(
        new Dictionary<string, Action<LightGbmRegressionTrainer.Options, double>>
        {
            ["learning_rate"] = (o, v) => o.LearningRate = v,
            ["leaves"] = (o, v) => o.NumberOfLeaves = (int)v,
            ["min_leaf_rows"] = (o, v) => o.MinimumExampleCountPerLeaf = (int)v,
            ["feature_fraction"] = (o, v) => Booster(o).FeatureFraction = v,
            ["row_fraction"] = (o, v) =>
            {
                Booster(o).SubsampleFraction = v;
                Booster(o).SubsampleFrequency = v < 1 ? 1 : 0;
            },
            ["l2"] = (o, v) => Booster(o).L2Regularization = v,
        });

    public string Family => FamilyNames.LightGbm;

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        // The same native library as the native learner: its process-wide thread count must not change under those fits.
        using var gate = Native.ThreadCountGate.Enter(job.Threads);
        return FoldFitter.Fit(Family, job, (ml, train) => ml.Regression.Trainers.LightGbm(Options(job)).Fit(train), cancellation);
    }

    internal static LightGbmRegressionTrainer.Options Options(FoldJob job)
    {
        var options = new LightGbmRegressionTrainer.Options
        {
            LabelColumnName = nameof(SparseFeatureRow.Label),
            FeatureColumnName = nameof(SparseFeatureRow.Features),
            NumberOfIterations = job.Budget,
            NumberOfThreads = job.Threads,
            Seed = job.Seed,
            Deterministic = true,
            Silent = true,
            Verbose = false,
            EvaluationMetric = LightGbmRegressionTrainer.Options.EvaluateMetricType.None,
            Booster = new GradientBooster.Options(),
        };
        Table.Apply(job.Parameters, options);
        return options;
    }

    private static GradientBooster.Options Booster(LightGbmRegressionTrainer.Options options) => (GradientBooster.Options)options.Booster;
}
