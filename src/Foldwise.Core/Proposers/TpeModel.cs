using Foldwise.Core.Search;

namespace Foldwise.Core.Proposers;

/// <summary>
/// The good density l and the rest density g, fitted on one window of results and reused until that window
/// changes. Results are ordered by (score, trial id) so ties split the same way on every replay. Candidates still
/// running (the liars) change with every decision, so they get a density of their own, mixed into g by count:
/// g = (n_rest·g_rest + n_liars·g_liars) / (n_rest + n_liars).
/// </summary>
internal sealed class TpeModel
{
    private readonly TpeDimension[] _dimensions;
    private readonly IJointDensity _good;
    private readonly IJointDensity _rest;
    private readonly int _restCount;
    private readonly bool _joint;

    private TpeModel(TrialReach budget, int results, TpeDimension[] dimensions, IJointDensity good, IJointDensity rest, int restCount, bool joint)
    {
        Budget = budget;
        Results = results;
        _dimensions = dimensions;
        _good = good;
        _rest = rest;
        _restCount = restCount;
        _joint = joint;
    }

    /// <summary>The budget fitted on, and how many results it had then: together they identify the window.</summary>
    public TrialReach Budget { get; }

    public int Results { get; }

    /// <summary>Orders results best first by (score, trial id).</summary>
    public static void SortByScore(List<Observation> window) =>
        window.Sort(static (a, b) => a.Score != b.Score ? a.Score.CompareTo(b.Score) : a.TrialId.CompareTo(b.TrialId));

    /// <param name="window">The results, already ordered best first.</param>
    /// <param name="top">
    /// How many of the window's first results reached the highest budget. With <see cref="TpeOptions.GoodFromTop"/> the
    /// good density is that share of them, at least two, and never more than γ of the window.
    /// </param>
    public static TpeModel Fit(TrialReach budget, int results, TpeDimension[] dimensions, List<Observation> window, TpeOptions options, int top = 0)
    {
        int n = window.Count;

        // The quantile is taken over real results only; liars always join the rest (they carry the worst score).
        int goodCount = Math.Clamp((int)Math.Ceiling(options.GoodFraction * n), 1, n - 1);
        if (top > 0 && options.GoodFromTop is double share)
        {
            goodCount = Math.Min(goodCount, Math.Max((int)Math.Ceiling(share * top), Math.Min(top, 2)));
        }

        var points = window.Select(o => ToModel(dimensions, o.Values)).ToList();
        var good = Estimate(dimensions, points[..goodCount], options.WideKernelWeight, options.Joint);
        var rest = Estimate(dimensions, points[goodCount..], options.WideKernelWeight, options.Joint);
        return new TpeModel(budget, results, dimensions, good, rest, n - goodCount, options.Joint);
    }

    /// <summary>Draws candidates from l and returns the one (in model coordinates) with the largest log l − log g.</summary>
    public double[] BestCandidate(Random random, int candidates, IReadOnlyCollection<double[]> pending)
    {
        var liars = pending.Count == 0
            ? null
            : Estimate(_dimensions, [.. pending.Select(p => ToModel(_dimensions, p))], wideKernelWeight: 0, _joint);
        double logRestShare = Math.Log(_restCount / (double)(_restCount + pending.Count));
        double logLiarShare = Math.Log(pending.Count / (double)(_restCount + pending.Count));
        double[] best = new double[_dimensions.Length];
        double[] draw = new double[_dimensions.Length];
        double bestScore = double.NegativeInfinity;
        for (int c = 0; c < candidates; c++)
        {
            _good.Sample(random, draw);
            double logG = _rest.LogDensity(draw);
            if (liars is not null)
            {
                logG = LogSum(logRestShare + logG, logLiarShare + liars.LogDensity(draw));
            }

            double score = _good.LogDensity(draw) - logG;
            if (score > bestScore)
            {
                bestScore = score;
                (best, draw) = (draw, best);
            }
        }

        return best;
    }

    private static double LogSum(double a, double b)
    {
        double max = Math.Max(a, b);
        return double.IsNegativeInfinity(max) ? max : max + Math.Log(Math.Exp(a - max) + Math.Exp(b - max));
    }

    private static double[] ToModel(TpeDimension[] dimensions, double[] values)
    {
        var point = new double[dimensions.Length];
        for (int d = 0; d < dimensions.Length; d++)
        {
            point[d] = dimensions[d].ToModel(values[dimensions[d].Index]);
        }

        return point;
    }

    private static IJointDensity Estimate(TpeDimension[] dimensions, List<double[]> points, double wideKernelWeight, bool joint) => joint
        ? ProductKernelDensity.Fit(dimensions, points, wideKernelWeight)
        : IndependentDensity.Fit(dimensions, points, wideKernelWeight);
}
