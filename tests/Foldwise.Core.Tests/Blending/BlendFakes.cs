using Foldwise.Core.Folds;

namespace Foldwise.Core.Tests.Blending;

/// <summary>Seeded, made-up blend problems shaped like out-of-fold predictions of a log-scale target.</summary>
internal static class BlendFakes
{
    public static double Normal(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    /// <summary>A target around 3–6 and columns = truth + bias + shared error + own noise.</summary>
    public static (double[][] Columns, double[] Target) Problem(int seed, int k, int n)
    {
        var random = new Random(seed);
        var truth = new double[n];
        var target = new double[n];
        var shared = new double[n];
        for (int i = 0; i < n; i++)
        {
            truth[i] = 3 + (2 * random.NextDouble());
            target[i] = truth[i] + (0.3 * Normal(random));
            shared[i] = Normal(random);
        }

        var columns = new double[k][];
        for (int j = 0; j < k; j++)
        {
            double bias = 0.2 * Normal(random);
            double load = 0.5 * random.NextDouble();
            double noise = 0.2 + (0.8 * random.NextDouble());
            columns[j] = new double[n];
            for (int i = 0; i < n; i++)
            {
                columns[j][i] = truth[i] + bias + (load * shared[i]) + (noise * Normal(random));
            }
        }

        return (columns, target);
    }

    /// <summary>Rows dealt to folds round-robin: row r is in fold r mod foldCount.</summary>
    public static FoldPlan RoundRobin(int rows, int foldCount) =>
        new(foldCount, 0, [.. Enumerable.Range(0, rows).Select(r => r % foldCount)]);

    public static double SumOfSquares(IReadOnlyList<double[]> columns, IReadOnlyList<double> weights, IReadOnlyList<double> y)
    {
        double sum = 0;
        for (int i = 0; i < y.Count; i++)
        {
            double fitted = 0;
            for (int j = 0; j < columns.Count; j++)
            {
                fitted += weights[j] * columns[j][i];
            }

            sum += (y[i] - fitted) * (y[i] - fitted);
        }

        return sum;
    }
}
