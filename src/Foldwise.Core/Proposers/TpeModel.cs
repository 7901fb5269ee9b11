namespace Foldwise.Core.Proposers;

/// <summary>
/// The good density l and the rest density g of every modelled parameter, fitted on one window of results and
/// reused until that window changes. Results are ordered by (score, trial id) so ties split the same way on every
/// replay. Candidates still running (the liars) change with every decision, so they get a density of their own,
/// mixed into g by count: g = (n_rest·g_rest + n_liars·g_liars) / (n_rest + n_liars).
/// </summary>
internal sealed class TpeModel
{
    private readonly TpeDimension[] _dimensions;
    private readonly IUnivariateDensity[] _good;
    private readonly IUnivariateDensity[] _rest;
    private readonly int _restCount;

    private TpeModel(int budget, int results, TpeDimension[] dimensions, IUnivariateDensity[] good, IUnivariateDensity[] rest, int restCount)
    {
        Budget = budget;
        Results = results;
        _dimensions = dimensions;
        _good = good;
        _rest = rest;
        _restCount = restCount;
    }

    /// <summary>The budget fitted on, and how many results it had then: together they identify the window.</summary>
    public int Budget { get; }

    public int Results { get; }

    public static TpeModel Fit(int budget, int results, TpeDimension[] dimensions, List<Observation> window, TpeOptions options)
    {
        window.Sort(static (a, b) => a.Score != b.Score ? a.Score.CompareTo(b.Score) : a.TrialId.CompareTo(b.TrialId));
        int n = window.Count;

        // The quantile is taken over real results only; liars always join the rest (they carry the worst score).
        int goodCount = Math.Clamp((int)Math.Ceiling(options.Gamma * n), 1, n - 1);
        var good = new IUnivariateDensity[dimensions.Length];
        var rest = new IUnivariateDensity[dimensions.Length];
        var goodValues = new double[goodCount];
        var restValues = new double[n - goodCount];
        for (int d = 0; d < dimensions.Length; d++)
        {
            var dim = dimensions[d];
            for (int i = 0; i < n; i++)
            {
                double value = dim.ToModel(window[i].Values[dim.Index]);
                if (i < goodCount)
                {
                    goodValues[i] = value;
                }
                else
                {
                    restValues[i - goodCount] = value;
                }
            }

            good[d] = Estimate(dim, goodValues, options.PriorWeight);
            rest[d] = Estimate(dim, restValues, options.PriorWeight);
        }

        return new TpeModel(budget, results, dimensions, good, rest, n - goodCount);
    }

    /// <summary>Draws candidates from l and returns the one (in model coordinates) with the largest Σ log l − log g.</summary>
    public double[] BestCandidate(Random random, int candidates, IReadOnlyCollection<double[]> pending)
    {
        var liars = pending.Count == 0 ? null : FitLiars(pending);
        double restShare = _restCount / (double)(_restCount + pending.Count);
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
                double g = _rest[d].Density(x);
                if (liars is not null)
                {
                    g = (restShare * g) + ((1 - restShare) * liars[d].Density(x));
                }

                score += Math.Log(_good[d].Density(x)) - Math.Log(g);
            }

            if (score > bestScore)
            {
                bestScore = score;
                (best, draw) = (draw, best);
            }
        }

        return best;
    }

    private IUnivariateDensity[] FitLiars(IReadOnlyCollection<double[]> pending)
    {
        var liars = new IUnivariateDensity[_dimensions.Length];
        var values = new double[pending.Count];
        for (int d = 0; d < _dimensions.Length; d++)
        {
            var dim = _dimensions[d];
            int i = 0;
            foreach (var point in pending)
            {
                values[i++] = dim.ToModel(point[dim.Index]);
            }

            liars[d] = Estimate(dim, values, priorWeight: 0);
        }

        return liars;
    }

    private static IUnivariateDensity Estimate(TpeDimension dim, double[] values, double priorWeight) => dim.IsChoice
        ? CategoricalEstimator.Fit(values, dim.Choices, priorWeight)
        : ParzenEstimator.Fit(values, dim.Low, dim.High, priorWeight);
}
