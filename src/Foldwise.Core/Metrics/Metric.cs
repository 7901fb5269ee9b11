namespace Foldwise.Core.Metrics;

/// <summary>
/// A metric with its target transform. Learners fit and the blend solves on the transformed scale
/// (log1p for RMSLE), so every score is computed there: RMSLE is RMSE of log1p values.
/// </summary>
public sealed class Metric
{
    public static Metric Rmsle { get; } = new(MetricKind.Rmsle, "RMSLE");

    public static Metric Rmse { get; } = new(MetricKind.Rmse, "RMSE");

    public static Metric Mae { get; } = new(MetricKind.Mae, "MAE");

    private Metric(MetricKind kind, string name)
    {
        Kind = kind;
        Name = name;
    }

    public MetricKind Kind { get; }

    public string Name { get; }

    /// <summary>Whether the target is fitted as log1p(y), which needs y ≥ 0.</summary>
    public bool UsesLogScale => Kind == MetricKind.Rmsle;

    public static Metric For(MetricKind kind) => kind switch
    {
        MetricKind.Rmsle => Rmsle,
        MetricKind.Rmse => Rmse,
        MetricKind.Mae => Mae,
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown metric"),
    };

    /// <summary>Original scale to the fitting scale.</summary>
    public double Forward(double y) => UsesLogScale ? Math.Log(1 + y) : y;

    /// <summary>Fitting scale back to the original; under RMSLE predictions are clamped at 0.</summary>
    public double Inverse(double t) => UsesLogScale ? Math.Max(0, Math.Exp(t) - 1) : t;

    /// <summary>
    /// What makes a target value unusable, or null when it is fine: NaN and infinities always,
    /// negatives under RMSLE.
    /// </summary>
    public string? TargetProblem(double y)
    {
        if (!double.IsFinite(y))
        {
            return $"target is {y}, which is not a finite number";
        }

        return UsesLogScale && y < 0 ? $"target {y} is negative, which {Name} cannot score" : null;
    }

    /// <summary>
    /// The score of predictions against actual values, both on the fitting scale. A prediction is
    /// first clamped as <see cref="Inverse"/> would clamp it, so the score is that of the written file.
    /// </summary>
    public double Score(ReadOnlySpan<double> actual, ReadOnlySpan<double> predicted)
    {
        if (actual.Length != predicted.Length || actual.Length == 0)
        {
            throw new ArgumentException("actual and predicted need the same, non-zero length");
        }

        double sum = 0;
        for (int i = 0; i < actual.Length; i++)
        {
            double p = UsesLogScale ? Math.Max(0, predicted[i]) : predicted[i];
            double e = actual[i] - p;
            sum += Kind == MetricKind.Mae ? Math.Abs(e) : e * e;
        }

        double mean = sum / actual.Length;
        return Kind == MetricKind.Mae ? mean : Math.Sqrt(mean);
    }

    /// <summary>The same, with predictions and actual values on the original scale.</summary>
    public double ScoreOriginal(ReadOnlySpan<double> actual, ReadOnlySpan<double> predicted)
    {
        var a = new double[actual.Length];
        var p = new double[predicted.Length];
        for (int i = 0; i < a.Length; i++)
        {
            a[i] = Forward(actual[i]);
        }

        for (int i = 0; i < p.Length; i++)
        {
            p[i] = Forward(Math.Max(UsesLogScale ? 0 : double.NegativeInfinity, predicted[i]));
        }

        return Score(a, p);
    }
}
