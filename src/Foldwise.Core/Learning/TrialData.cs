using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;

namespace Foldwise.Core.Learning;

/// <summary>
/// What every trial of a search reads: the screened training and test features row by row (missing cells NaN),
/// the target already on the fitting scale, the fold plan, the metric, and the category columns that each fold
/// encodes on its own training rows. Built once per worker and search.
/// </summary>
public sealed record TrialData(
    SparseRowMatrix Train,
    double[] Target,
    SparseRowMatrix Test,
    FoldPlan Folds,
    Metric Metric,
    ImmutableArray<TrialCategory> Categories = default)
{
    public static TrialData From(FeatureTable train, FeatureTable test, FoldPlan folds, Metric metric) =>
        new(train.ToRows(), [.. train.Target.Select(metric.Forward)], test.ToRows(), folds, metric, TrialCategories.From(train, test, EncodingOptions.Default));

    /// <summary>
    /// One fold's learner inputs, encoded from that fold's training rows only. They depend on the fold alone, never on
    /// a trial, so every trial of the fold trains on the same inputs and its binned rows can be reused.
    /// </summary>
    public FoldInputs InputsFor(int fold)
    {
        var inputs = FoldEncoder.Prepare(this, Folds.TrainRows(fold), SearchSeeds.Encoding(Folds.Seed, fold), EncodingOptions.Default);
        return new FoldInputs(inputs.Train, inputs.Test) { PlanFold = fold };
    }
}
