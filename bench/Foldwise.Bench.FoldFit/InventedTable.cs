using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Bench.FoldFit;

/// <summary>
/// An invented table of the size many users have: <c>rows</c> × 250 features, each cell non-zero with
/// probability 0.08 as a count 1–5, and a right-skewed target: log1p(y) = 6 + a few columns' effects + noise.
/// </summary>
internal static class InventedTable
{
    public const int Features = 250;

    public static (FeatureTable Train, FeatureTable Test) Generate(int rows, int testRows, int seed)
    {
        var random = new Random(seed);
        var weights = Enumerable.Range(0, Features).Select(c => c < 25 ? (random.NextDouble() - 0.3) * 0.4 : 0).ToArray();
        return (Table("invented-train.csv", rows, random, weights, withTarget: true), Table("invented-test.csv", testRows, random, weights, withTarget: false));
    }

    private static FeatureTable Table(string name, int rows, Random random, double[] weights, bool withTarget)
    {
        var cells = new List<(int Row, float Value)>[Features];
        for (int c = 0; c < Features; c++)
        {
            cells[c] = [];
        }

        var target = ImmutableArray.CreateBuilder<double>(rows);
        for (int r = 0; r < rows; r++)
        {
            double log = 6 + (0.5 * (random.NextDouble() - 0.5));
            for (int c = 0; c < Features; c++)
            {
                if (random.NextDouble() < 0.08)
                {
                    int count = random.Next(1, 6);
                    cells[c].Add((r, count));
                    log += weights[c] * Math.Sqrt(count);
                }
            }

            target.Add(Math.Exp(log) - 1);
        }

        return new FeatureTable(
            name,
            [.. Enumerable.Range(0, rows).Select(r => $"r{r}")],
            [.. Enumerable.Range(0, Features).Select(c => $"x{c}")],
            [.. cells.Select(list => new SparseColumn([.. list.Select(p => p.Row)], [.. list.Select(p => p.Value)]))],
            withTarget ? target.MoveToImmutable() : []);
    }
}
