namespace Foldwise.Core.Proposers;

/// <summary>
/// A Parzen density over all parameters jointly: one kernel per point that is the product of that point's kernels
/// in every parameter (bandwidths as <see cref="ParzenEstimator"/> picks them per parameter), plus a prior kernel at
/// the middle of the space, as wide as the space. Unlike <see cref="IndependentDensity"/> it keeps which values came
/// together, so l(x)/g(x) rewards combinations that worked, as the multivariate densities of Falkner et al. (BOHB,
/// ICML 2018) do. A choice's kernel keeps <see cref="ChoiceKeep"/> of its mass on the point's choice and spreads
/// the rest evenly.
/// </summary>
internal sealed class ProductKernelDensity : IJointDensity
{
    /// <summary>Mass a choice kernel keeps on its own point's choice (a round value, not measured here).</summary>
    public const double ChoiceKeep = 0.75;

    private readonly TpeDimension[] _dimensions;
    private readonly ParzenEstimator?[] _numeric;
    private readonly int[][] _choices; // per choice parameter, each point's choice index (others null)
    private readonly double[] _logWeights;
    private readonly double[] _cumulative;
    private readonly bool _prior;
    private readonly double[] _terms; // scratch for LogDensity: a model serves one decision at a time (the coordinator is single-threaded)

    private ProductKernelDensity(TpeDimension[] dimensions, ParzenEstimator?[] numeric, int[][] choices, double[] weights, bool prior)
    {
        _dimensions = dimensions;
        _numeric = numeric;
        _choices = choices;
        _prior = prior;
        double total = weights.Sum();
        _logWeights = new double[weights.Length];
        _cumulative = new double[weights.Length];
        double running = 0;
        for (int i = 0; i < weights.Length; i++)
        {
            _logWeights[i] = Math.Log(weights[i] / total);
            running += weights[i] / total;
            _cumulative[i] = running;
        }

        _terms = new double[weights.Length];
    }

    /// <summary>Fits one product kernel per point; a prior weight of 0 leaves the prior kernel out (for the liars' density).</summary>
    public static ProductKernelDensity Fit(TpeDimension[] dimensions, IReadOnlyList<double[]> points, double wideKernelWeight)
    {
        bool prior = wideKernelWeight > 0;
        int n = points.Count;
        var numeric = new ParzenEstimator?[dimensions.Length];
        var choices = new int[dimensions.Length][];
        var column = new double[n];
        for (int d = 0; d < dimensions.Length; d++)
        {
            for (int i = 0; i < n; i++)
            {
                column[i] = points[i][d];
            }

            var dim = dimensions[d];
            if (dim.IsChoice)
            {
                choices[d] = [.. column.Select(v => Math.Clamp((int)v, 0, dim.Choices - 1))];
            }
            else
            {
                // Kernel i of the fit is point i; the prior, when there is one, is kernel n.
                numeric[d] = ParzenEstimator.Fit(column, dim.Low, dim.High, wideKernelWeight);
            }
        }

        var weights = new double[n + (prior ? 1 : 0)];
        Array.Fill(weights, 1.0, 0, n);
        if (prior)
        {
            weights[n] = wideKernelWeight;
        }

        return new ProductKernelDensity(dimensions, numeric, choices, weights, prior);
    }

    public double LogDensity(double[] x)
    {
        // log Σ_k w_k Π_d K_kd(x_d), summed in log space: a product of six narrow kernels underflows a double far from its point.
        double max = double.NegativeInfinity;
        for (int k = 0; k < _terms.Length; k++)
        {
            double term = _logWeights[k];
            for (int d = 0; d < _dimensions.Length; d++)
            {
                term += KernelLog(k, d, x[d]);
            }

            _terms[k] = term;
            max = Math.Max(max, term);
        }

        double sum = 0;
        for (int k = 0; k < _terms.Length; k++)
        {
            sum += Math.Exp(_terms[k] - max);
        }

        return max + Math.Log(sum);
    }

    public void Sample(Random random, double[] into)
    {
        int k = Array.BinarySearch(_cumulative, random.NextDouble());
        k = Math.Min(k >= 0 ? k + 1 : ~k, _cumulative.Length - 1);
        for (int d = 0; d < _dimensions.Length; d++)
        {
            var dim = _dimensions[d];
            if (dim.IsChoice)
            {
                into[d] = IsPrior(k) || random.NextDouble() >= ChoiceKeep ? random.Next(dim.Choices) : _choices[d][k];
            }
            else
            {
                double x = _numeric[d]!.SampleKernel(k, random);
                into[d] = dim.Range.Kind is Spaces.ParameterKind.Whole ? dim.ToValue(x) : x;
            }
        }
    }

    private bool IsPrior(int k) => _prior && k == _cumulative.Length - 1;

    private double KernelLog(int k, int d, double x)
    {
        if (_numeric[d] is { } parzen)
        {
            return parzen.KernelLogDensity(k, x);
        }

        int choices = _dimensions[d].Choices;
        if (IsPrior(k))
        {
            return -Math.Log(choices);
        }

        double spread = (1 - ChoiceKeep) / choices;
        return Math.Log((int)x == _choices[d][k] ? ChoiceKeep + spread : spread);
    }
}
