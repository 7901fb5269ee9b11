using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Trainers.FastTree;

namespace Foldwise.Learners;

/// <summary>
/// ML.NET's FastTree regression, budget = trees. Seeded; bagging every tree when row_fraction &lt; 1.
/// Unlike LightGBM it trains in parallel within one process.
/// </summary>
public sealed class FastTreeLearner : IFoldLearner, IKeepsModels
{
    internal static readonly OptionTable<FastTreeRegressionTrainer.Options> Table = new(
        new Dictionary<string, Action<FastTreeRegressionTrainer.Options, double>>
        {
            ["learning_rate"] = (o, v) => o.LearningRate = v,
            ["leaves"] = (o, v) => o.NumberOfLeaves = (int)v,
            ["min_leaf_rows"] = (o, v) => o.MinimumExampleCountPerLeaf = (int)v,
            ["feature_fraction"] = (o, v) => o.FeatureFraction = v,
            ["row_fraction"] = (o, v) =>
            {
                o.BaggingExampleFraction = v;
                o.BaggingSize = v < 1 ? 1 : 0;
            },
        });

    public string Family => FamilyNames.FastTree;

    // ML.NET 5 FastTree skips training rows that hold a NaN feature and scores NaN as neither zero nor those rows
    // (MissingCellTests), so it reads the fold's median-imputed inputs with their "was missing" columns.
    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.Fit(Family, job, (ml, train) => ml.Regression.Trainers.FastTree(Options(job)).Fit(train), cancellation);

    public KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.FitAndKeep(Family, job, (ml, train) => ml.Regression.Trainers.FastTree(Options(job)).Fit(train), cancellation);

    public double[] PredictKept(FoldJob job, byte[] model) => FoldFitter.PredictKept(Family, job, model);

    internal static FastTreeRegressionTrainer.Options Options(FoldJob job)
    {
        var options = new FastTreeRegressionTrainer.Options
        {
            LabelColumnName = nameof(SparseFeatureRow.Label),
            FeatureColumnName = nameof(SparseFeatureRow.Features),
            NumberOfTrees = job.Budget,
            NumberOfThreads = job.Threads,
            Seed = job.Seed,
            DiskTranspose = false,
        };
        Table.Apply(job.Parameters, options);
        return options;
    }
}
