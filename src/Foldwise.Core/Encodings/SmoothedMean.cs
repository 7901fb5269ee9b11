namespace Foldwise.Core.Encodings;

/// <summary>
/// The smoothed level mean of Micci-Barreca, "A preprocessing scheme for high-cardinality categorical attributes", SIGKDD Explorations 3(1), 2001:
/// λ(n) = 1 / (1 + exp(−(n − k) / f)) and encoding = λ(n)·(level mean) + (1 − λ(n))·prior.
/// A level with no rows takes the prior.
/// </summary>
public static class SmoothedMean
{
    public static double Of(double levelSum, int levelCount, double prior, double minSamples, double steepness)
    {
        if (levelCount == 0)
        {
            return prior;
        }

        double weight = 1 / (1 + Math.Exp(-(levelCount - minSamples) / steepness));
        return (weight * (levelSum / levelCount)) + ((1 - weight) * prior);
    }
}
