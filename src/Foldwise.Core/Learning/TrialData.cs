using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;

namespace Foldwise.Core.Learning;

/// <summary>
/// What every trial of a search reads: the screened training and test features row by row,
/// the target already on the fitting scale, the fold plan and the metric. Built once per worker and search.
/// </summary>
public sealed record TrialData(SparseRowMatrix Train, double[] Target, SparseRowMatrix Test, FoldPlan Folds, Metric Metric)
{
    public static TrialData From(FeatureTable train, FeatureTable test, FoldPlan folds, Metric metric) =>
        new(train.ToRows(), [.. train.Target.Select(metric.Forward)], test.ToRows(), folds, metric);
}
