using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Microsoft.ML;
using Microsoft.ML.Trainers;

namespace Foldwise.Learners;

/// <summary>
/// ML.NET's SDCA regression with squared loss and an L2 penalty (ridge), budget = passes over the fold's training
/// rows, on inputs prepared from those rows only (<see cref="Core.Preparation.ColumnScaling"/>), after median imputation (SDCA predicts NaN for a NaN cell). SDCA's L1
/// option is left at 0: its fits matched no mapping onto scikit-learn's ElasticNet penalties (seen 2026-12-05).
/// </summary>
public sealed class LinearLearner : IFoldLearner, IKeepsModels
{
    /// <summary>
    /// SDCA stops before its budget once the duality gap is this small relative to the loss. At ML.NET's regression
    /// default (0.01) and at 1e-6 its predictions stayed up to 0.5 % of the target's spread from the exact ridge
    /// solution (LinearReferenceTests).
    /// </summary>
    public const float ConvergenceTolerance = 1e-9f;

    internal static readonly OptionTable<SdcaRegressionTrainer.Options> Table = new(
        new Dictionary<string, Action<SdcaRegressionTrainer.Options, double>>
        {
            ["l2"] = (o, v) => o.L2Regularization = (float)v,
        });

    public string Family => FamilyNames.Linear;

    // SDCA trains a NaN cell as 0 and predicts NaN for it (MissingCellTests): its descriptor asks for scaled, imputed inputs.
    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.Fit(Family, job, (ml, train) => ml.Regression.Trainers.Sdca(Options(job)).Fit(train), cancellation);

    public KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation) =>
        FoldFitter.FitAndKeep(Family, job, (ml, train) => ml.Regression.Trainers.Sdca(Options(job)).Fit(train), cancellation);

    public double[] PredictKept(FoldJob job, byte[] model) => FoldFitter.PredictKept(Family, job, model);

    internal static SdcaRegressionTrainer.Options Options(FoldJob job)
    {
        var options = new SdcaRegressionTrainer.Options
        {
            LabelColumnName = nameof(SparseFeatureRow.Label),
            FeatureColumnName = nameof(SparseFeatureRow.Features),
            MaximumNumberOfIterations = job.Budget,
            ConvergenceTolerance = ConvergenceTolerance,
            L1Regularization = 0,

            // SDCA's threads update the weights without locks, so more than one makes a fit depend on timing.
            NumberOfThreads = 1,
        };
        Table.Apply(job.Parameters, options);
        return options;
    }
}
