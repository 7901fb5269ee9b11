namespace Foldwise.Core.Demo;

/// <summary>The few distributions the demo draws from, on a caller's seeded <see cref="Random"/>.</summary>
internal static class RandomDraws
{
    /// <summary>Standard normal by Box–Muller (one of the pair is discarded: simple, and speed is not an issue here).</summary>
    public static double Normal(this Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    /// <summary>Poisson: Knuth's product method for small means, a rounded normal above 30 (common practice).</summary>
    public static int Poisson(this Random random, double mean)
    {
        if (mean > 30)
        {
            return Math.Max(0, (int)Math.Round(mean + (Math.Sqrt(mean) * random.Normal())));
        }

        double limit = Math.Exp(-mean);
        double product = random.NextDouble();
        int count = 0;
        while (product > limit)
        {
            count++;
            product *= random.NextDouble();
        }

        return count;
    }

    /// <summary>An index drawn with probability proportional to its weight, from cumulative weights.</summary>
    public static int Pick(this Random random, double[] cumulative)
    {
        int at = Array.BinarySearch(cumulative, random.NextDouble() * cumulative[^1]);
        return Math.Min(at < 0 ? ~at : at, cumulative.Length - 1);
    }
}
