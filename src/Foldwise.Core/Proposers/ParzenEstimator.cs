namespace Foldwise.Core.Proposers;

/// <summary>
/// A one-dimensional Parzen density on [low, high]: one Gaussian kernel per point, truncated to the interval and
/// renormalised, plus a prior kernel at the midpoint as wide as the interval. Each point's bandwidth is the
/// larger distance to its left and right neighbours (Bergstra et al., NeurIPS 2011, §4, from memory: "clipped to
/// remain in a reasonable range"), clipped here to [(high − low)/min(100, 1 + n), high − low] (common practice).
/// </summary>
internal sealed class ParzenEstimator : IUnivariateDensity
{
    private const int SampleTries = 64;

    private readonly double _low;
    private readonly double _high;
    private readonly double[] _means;
    private readonly double[] _inverseSigmas;
    private readonly double[] _sigmas;
    private readonly double[] _scales;
    private readonly double[] _logNorms;
    private readonly double[] _cumulative;

    private ParzenEstimator(double low, double high, double[] means, double[] sigmas, double[] weights)
    {
        _low = low;
        _high = high;
        _means = means;
        _sigmas = sigmas;
        _inverseSigmas = new double[means.Length];
        _scales = new double[means.Length];
        _logNorms = new double[means.Length];
        _cumulative = new double[means.Length];
        double total = weights.Sum();
        double running = 0;
        for (int i = 0; i < means.Length; i++)
        {
            // Truncation to [low, high] renormalises each kernel by the mass it keeps inside the interval.
            double mass = Gaussian.Cdf((high - means[i]) / sigmas[i]) - Gaussian.Cdf((low - means[i]) / sigmas[i]);
            _inverseSigmas[i] = 1.0 / sigmas[i];
            double norm = Gaussian.InverseSqrtTwoPi / (sigmas[i] * Math.Max(mass, 1e-12));
            _scales[i] = weights[i] / total * norm;
            _logNorms[i] = Math.Log(norm);
            running += weights[i] / total;
            _cumulative[i] = running;
        }
    }

    public int Kernels => _means.Length;

    /// <summary>Fits kernels on the points; a prior weight of 0 leaves the prior kernel out (for the liars' density).</summary>
    public static ParzenEstimator Fit(ReadOnlySpan<double> points, double low, double high, double wideKernelWeight)
    {
        bool prior = wideKernelWeight > 0;
        int n = points.Length;
        int kernels = n + (prior ? 1 : 0);
        double width = high - low;
        var means = new double[kernels];
        var weights = new double[kernels];
        points.CopyTo(means);
        Array.Fill(weights, 1.0, 0, n);
        if (prior)
        {
            means[n] = low + (width / 2);
            weights[n] = wideKernelWeight;
        }

        // Sort kernels by mean (the prior among them, as a neighbour) to find each point's neighbours.
        var order = new int[kernels];
        for (int i = 0; i < kernels; i++)
        {
            order[i] = i;
        }

        var keys = (double[])means.Clone();
        Array.Sort(keys, order);
        var sigmas = new double[kernels];
        double minSigma = width / Math.Min(100.0, 1.0 + n);
        for (int k = 0; k < kernels; k++)
        {
            int i = order[k];
            if (i == n)
            {
                sigmas[i] = width;
                continue;
            }

            double left = k > 0 ? keys[k - 1] : low;
            double right = k < kernels - 1 ? keys[k + 1] : high;
            double sigma = Math.Max(keys[k] - left, right - keys[k]);
            sigmas[i] = Math.Clamp(sigma, minSigma, width);
        }

        return new ParzenEstimator(low, high, means, sigmas, weights);
    }

    public double Density(double x)
    {
        double sum = 0;
        for (int i = 0; i < _means.Length; i++)
        {
            // Kernels more than √32 ≈ 5.7σ away add under e^-16 ≈ 1e-7 of their peak: skipping their exp keeps a decision cheap
            // when hundreds of narrow kernels sit far from x.
            double z = (x - _means[i]) * _inverseSigmas[i];
            if (z * z < 32)
            {
                sum += _scales[i] * Math.Exp(-0.5 * z * z);
            }
        }

        return sum;
    }

    public double Sample(Random random)
    {
        double u = random.NextDouble();
        int i = Array.BinarySearch(_cumulative, u);
        return SampleKernel(Math.Min(i >= 0 ? i + 1 : ~i, _means.Length - 1), random);
    }

    /// <summary>log of kernel <paramref name="i"/>'s own (truncated, unweighted) density at x; kernel i is point i, the prior last.</summary>
    public double KernelLogDensity(int i, double x)
    {
        double z = (x - _means[i]) * _inverseSigmas[i];
        return _logNorms[i] - (0.5 * z * z);
    }

    /// <summary>A draw from kernel <paramref name="i"/> alone, inside [low, high].</summary>
    public double SampleKernel(int i, Random random)
    {
        for (int attempt = 0; attempt < SampleTries; attempt++)
        {
            double x = _means[i] + (_sigmas[i] * Gaussian.Sample(random));
            if (x >= _low && x <= _high)
            {
                return x;
            }
        }

        return Math.Clamp(_means[i], _low, _high);
    }
}
