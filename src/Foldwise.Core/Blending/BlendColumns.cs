using System.Numerics;

namespace Foldwise.Core.Blending;

/// <summary>Input checks and the direct (not Gram-based) residual and combination of prediction columns.</summary>
internal static class BlendColumns
{
    /// <summary>Checks the columns against the target and returns the target as an array.</summary>
    public static double[] Validated(IReadOnlyList<double[]> columns, ReadOnlySpan<double> y)
    {
        ArgumentNullException.ThrowIfNull(columns);
        if (columns.Count == 0)
        {
            throw new ArgumentException("at least one column is needed", nameof(columns));
        }

        if (y.IsEmpty)
        {
            throw new ArgumentException("the target has no rows", nameof(y));
        }

        RequireFinite(y, "the target");
        for (int j = 0; j < columns.Count; j++)
        {
            if (columns[j] is null || columns[j].Length != y.Length)
            {
                throw new ArgumentException($"column {j} has {columns[j]?.Length ?? 0} rows, the target {y.Length}", nameof(columns));
            }

            RequireFinite(columns[j], $"column {j}");
        }

        return y.ToArray();
    }

    public static void RequireFinite(ReadOnlySpan<double> values, string what)
    {
        for (int i = 0; i < values.Length; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException($"{what} holds {values[i]} at row {i}");
            }
        }
    }

    /// <summary>Σ wⱼ columnⱼ, skipping zero weights.</summary>
    public static double[] Combine(IReadOnlyList<double> weights, IReadOnlyList<double[]> columns, int length)
    {
        var sum = new double[length];
        var target = sum.AsSpan();
        for (int j = 0; j < columns.Count; j++)
        {
            double w = weights[j];
            if (w == 0)
            {
                continue;
            }

            var column = columns[j].AsSpan();
            var scale = new Vector<double>(w);
            int width = Vector<double>.Count;
            int i = 0;
            for (; i <= length - width; i += width)
            {
                var acc = new Vector<double>(target[i..]);
                Vector.FusedMultiplyAdd(scale, new Vector<double>(column[i..]), acc).CopyTo(target[i..]);
            }

            for (; i < length; i++)
            {
                target[i] = Math.FusedMultiplyAdd(w, column[i], target[i]);
            }
        }

        return sum;
    }

    /// <summary>‖y − P w‖² computed from the residual itself, so it is exact to rounding even near zero.</summary>
    public static double SumOfSquares(IReadOnlyList<double[]> columns, IReadOnlyList<double> weights, double[] y)
    {
        var fitted = Combine(weights, columns, y.Length);
        double sum = 0;
        for (int i = 0; i < y.Length; i++)
        {
            double e = y[i] - fitted[i];
            sum += e * e;
        }

        return sum;
    }
}
