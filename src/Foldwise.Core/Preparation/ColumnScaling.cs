using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Core.Preparation;

/// <summary>
/// A linear model's inputs, learnt from one fold's training rows only: log1p of each skewed non-negative column,
/// then each column divided by its standard deviation. Columns are scaled, not centred, so zeros stay zeros and
/// the table stays sparse; the model's intercept takes up the column means. A column constant on the training rows
/// carries nothing and is scaled to zero.
/// </summary>
public sealed class ColumnScaling
{
    /// <summary>Sample skewness above 1 counts as highly skewed (common practice).</summary>
    public const double SkewLimit = 1.0;

    private ColumnScaling(ImmutableArray<bool> logged, ImmutableArray<double> factors)
    {
        Logged = logged;
        Factors = factors;
    }

    /// <summary>Whether column c is taken through log1p before scaling.</summary>
    public ImmutableArray<bool> Logged { get; }

    /// <summary>What column c is multiplied by after the log step: 1 / standard deviation, or 0 for a constant column.</summary>
    public ImmutableArray<double> Factors { get; }

    /// <summary>Learns the scaling from <paramref name="rows"/> of <paramref name="table"/>; every cell must be a number.</summary>
    public static ColumnScaling Learn(SparseRowMatrix table, ImmutableArray<int> rows)
    {
        ArgumentOutOfRangeException.ThrowIfZero(rows.Length);
        var raw = Moments.Of(table, rows, logged: null);
        var logged = ImmutableArray.CreateRange(Enumerable.Range(0, table.ColumnCount).Select(c => raw.NonNegative(c) && raw.Skewness(c) > SkewLimit));
        var after = Moments.Of(table, rows, logged);
        var factors = ImmutableArray.CreateRange(Enumerable.Range(0, table.ColumnCount).Select(c =>
        {
            double sd = after.StandardDeviation(c);
            return sd > 1e-12 ? 1 / sd : 0;
        }));
        return new ColumnScaling(logged, factors);
    }

    /// <summary>The whole table prepared with this scaling (training, held-out and test rows alike).</summary>
    public SparseRowMatrix Apply(SparseRowMatrix table)
    {
        if (table.ColumnCount != Factors.Length)
        {
            throw new ArgumentException($"the table has {table.ColumnCount} columns, the scaling {Factors.Length}", nameof(table));
        }

        var values = new float[table.Values.Length];
        for (int k = 0; k < values.Length; k++)
        {
            int c = table.ColumnIndices[k];
            double x = table.Values[k];
            values[k] = (float)((Logged[c] ? Math.Log(1 + Math.Max(x, 0)) : x) * Factors[c]);
        }

        return new SparseRowMatrix(table.RowCount, table.ColumnCount, table.RowStarts, table.ColumnIndices, values);
    }

    /// <summary>Per-column power sums over some rows, implicit zeros included.</summary>
    private sealed class Moments
    {
        private readonly int count;
        private readonly double[] s1;
        private readonly double[] s2;
        private readonly double[] s3;
        private readonly bool[] negative;

        private Moments(int count, int columns)
        {
            this.count = count;
            s1 = new double[columns];
            s2 = new double[columns];
            s3 = new double[columns];
            negative = new bool[columns];
        }

        public static Moments Of(SparseRowMatrix table, ImmutableArray<int> rows, ImmutableArray<bool>? logged)
        {
            var m = new Moments(rows.Length, table.ColumnCount);
            foreach (int r in rows)
            {
                var columns = table.RowColumns(r);
                var values = table.RowValues(r);
                for (int k = 0; k < columns.Length; k++)
                {
                    int c = columns[k];
                    double x = values[k];
                    if (logged is { } l && l[c])
                    {
                        x = Math.Log(1 + x);
                    }

                    m.negative[c] |= x < 0;
                    m.s1[c] += x;
                    m.s2[c] += x * x;
                    m.s3[c] += x * x * x;
                }
            }

            return m;
        }

        public bool NonNegative(int c) => !negative[c];

        public double StandardDeviation(int c) => Math.Sqrt(Variance(c));

        /// <summary>The population skewness g1 = m3 / m2^1.5; 0 for a constant column.</summary>
        public double Skewness(int c)
        {
            double mean = s1[c] / count;
            double m2 = Variance(c);
            if (m2 <= 1e-24)
            {
                return 0;
            }

            double m3 = (s3[c] / count) - (3 * mean * s2[c] / count) + (2 * mean * mean * mean);
            return m3 / Math.Pow(m2, 1.5);
        }

        private double Variance(int c)
        {
            double mean = s1[c] / count;
            return Math.Max(0, (s2[c] / count) - (mean * mean));
        }
    }
}
