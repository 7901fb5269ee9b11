namespace Foldwise.Core.Proposers;

/// <summary>
/// A distribution over a choice's indices: observed counts plus a pseudo-count of the prior weight for every
/// choice, so an unseen choice keeps some probability (Bergstra et al., NeurIPS 2011, §4, from memory: counts
/// re-weighted with the prior). A prior weight of 0 gives plain counts (for the liars' distribution).
/// </summary>
internal sealed class CategoricalEstimator : IUnivariateDensity
{
    private readonly double[] _probabilities;
    private readonly double[] _cumulative;

    private CategoricalEstimator(double[] probabilities)
    {
        _probabilities = probabilities;
        _cumulative = new double[probabilities.Length];
        double running = 0;
        for (int i = 0; i < probabilities.Length; i++)
        {
            running += probabilities[i];
            _cumulative[i] = running;
        }
    }

    public static CategoricalEstimator Fit(ReadOnlySpan<double> indices, int choices, double wideKernelWeight)
    {
        var counts = new double[choices];
        Array.Fill(counts, wideKernelWeight);
        foreach (double index in indices)
        {
            counts[Math.Clamp((int)index, 0, choices - 1)] += 1.0;
        }

        double total = counts.Sum();
        for (int i = 0; i < choices; i++)
        {
            counts[i] /= total;
        }

        return new CategoricalEstimator(counts);
    }

    public double Density(double index) => _probabilities[Math.Clamp((int)index, 0, _probabilities.Length - 1)];

    public double Sample(Random random)
    {
        double u = random.NextDouble() * _cumulative[^1];
        int i = Array.BinarySearch(_cumulative, u);
        return Math.Min(i >= 0 ? i + 1 : ~i, _probabilities.Length - 1);
    }
}
