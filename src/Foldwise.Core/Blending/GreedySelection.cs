namespace Foldwise.Core.Blending;

/// <summary>
/// Greedy forward selection with replacement (Caruana, Niculescu-Mizil, Crew and Ksikes, "Ensemble
/// Selection from Libraries of Models", ICML 2004): each round adds the column whose inclusion makes
/// the running average fit y best, ties to the lower index; weights are counts / rounds. It climbs on
/// the rows it scores, so its in-sample score is optimistic — the nested estimate shows by how much.
/// </summary>
public static class GreedySelection
{
    /// <summary>The selection weights after <paramref name="rounds"/> rounds (at least 1) and their objective.</summary>
    public static BlendWeights Solve(IReadOnlyList<double[]> columns, ReadOnlySpan<double> y, int rounds)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(rounds, 1);
        var target = BlendColumns.Validated(columns, y);
        var weights = SolveGram(Gram.Of(columns, shift: target), rounds);
        return new BlendWeights(weights, BlendColumns.SumOfSquares(columns, weights, target));
    }

    /// <summary>
    /// Works on the error Gram E: with counts a after m picks, adding column j gives the average error
    /// (aᵀEa + 2(Ea)ⱼ + Eⱼⱼ)/(m+1)², so a round costs O(k) with Ea kept up to date.
    /// </summary>
    internal static double[] SolveGram(Gram e, int rounds)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(rounds, 1);
        int k = e.Size;
        var counts = new int[k];
        var product = new double[k];
        double quadratic = 0;
        for (int round = 0; round < rounds; round++)
        {
            int best = 0;
            double bestValue = double.PositiveInfinity;
            for (int j = 0; j < k; j++)
            {
                double value = quadratic + (2 * product[j]) + e[j, j];
                if (value < bestValue)
                {
                    best = j;
                    bestValue = value;
                }
            }

            counts[best]++;
            quadratic = bestValue;
            for (int i = 0; i < k; i++)
            {
                product[i] += e[i, best];
            }
        }

        var weights = new double[k];
        for (int j = 0; j < k; j++)
        {
            weights[j] = (double)counts[j] / rounds;
        }

        return weights;
    }
}
