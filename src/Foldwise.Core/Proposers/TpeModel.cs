namespace Foldwise.Core.Proposers;

/// <summary>
/// The good density l and the rest density g of every modelled parameter, fitted once per proposal.
/// Results are ordered by (score, trial id) so ties split the same way on every replay.
/// </summary>
internal sealed class TpeModel
{
    private readonly TpeDimension[] _dimensions;
    private readonly IUnivariateDensity[] _good;
    private readonly IUnivariateDensity[] _rest;

    private TpeModel(TpeDimension[] dimensions, IUnivariateDensity[] good, IUnivariateDensity[] rest)
    {
        _dimensions = dimensions;
        _good = good;
        _rest = rest;
    }

    public static TpeModel Fit(TpeDimension[] dimensions, List<Observation> results, IReadOnlyCollection<double[]> pending, TpeOptions options)
    {
        results.Sort(static (a, b) => a.Score != b.Score ? a.Score.CompareTo(b.Score) : a.TrialId.CompareTo(b.TrialId));
        int n = results.Count;

        // The quantile is taken over real results only; liars join the rest (they carry the worst score).
        int goodCount = Math.Clamp((int)Math.Ceiling(options.Gamma * n), 1, n - 1);
        int restCount = n - goodCount + pending.Count;
        var good = new IUnivariateDensity[dimensions.Length];
        var rest = new IUnivariateDensity[dimensions.Length];
        var goodValues = new double[goodCount];
        var restValues = new double[restCount];
        for (int d = 0; d < dimensions.Length; d++)
        {
            var dim = dimensions[d];
            for (int i = 0; i < goodCount; i++)
            {
                goodValues[i] = dim.ToModel(results[i].Values[dim.Index]);
            }

            int r = 0;
            for (int i = goodCount; i < n; i++)
            {
                restValues[r++] = dim.ToModel(results[i].Values[dim.Index]);
            }

            foreach (var liar in pending)
            {
                restValues[r++] = dim.ToModel(liar[dim.Index]);
            }

            good[d] = Estimate(dim, goodValues, options.PriorWeight);
            rest[d] = Estimate(dim, restValues, options.PriorWeight);
        }

        return new TpeModel(dimensions, good, rest);
    }

    /// <summary>Draws candidates from l and returns the one (in model coordinates) with the largest Σ log l − log g.</summary>
    public double[] BestCandidate(Random random, int candidates)
    {
        double[] best = new double[_dimensions.Length];
        double[] draw = new double[_dimensions.Length];
        double bestScore = double.NegativeInfinity;
        for (int c = 0; c < candidates; c++)
        {
            double score = 0;
            for (int d = 0; d < _dimensions.Length; d++)
            {
                var dim = _dimensions[d];
                double x = _good[d].Sample(random);
                if (dim.Range.Kind is Spaces.ParameterKind.Integer)
                {
                    // Evaluate whole numbers where they will actually be tried.
                    x = dim.ToValue(x);
                }

                draw[d] = x;
                score += Math.Log(_good[d].Density(x)) - Math.Log(_rest[d].Density(x));
            }

            if (score > bestScore)
            {
                bestScore = score;
                (best, draw) = (draw, best);
            }
        }

        return best;
    }

    private static IUnivariateDensity Estimate(TpeDimension dim, double[] values, double priorWeight) => dim.IsChoice
        ? CategoricalEstimator.Fit(values, dim.Choices, priorWeight)
        : ParzenEstimator.Fit(values, dim.Low, dim.High, priorWeight);
}
