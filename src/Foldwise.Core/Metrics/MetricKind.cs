namespace Foldwise.Core.Metrics;

/// <summary>How a search is scored. The default is <see cref="Rmsle"/>.</summary>
public enum MetricKind
{
    /// <summary>Root mean squared logarithmic error: RMSE on log1p(y); the target must be ≥ 0.</summary>
    Rmsle,

    /// <summary>Root mean squared error on the original scale.</summary>
    Rmse,

    /// <summary>Mean absolute error on the original scale.</summary>
    Mae,
}
