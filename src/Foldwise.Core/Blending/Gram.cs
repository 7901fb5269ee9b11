namespace Foldwise.Core.Blending;

/// <summary>
/// A symmetric k × k matrix of column inner products, stored dense and row-major. Solvers work on it
/// instead of the columns, so a fit over n rows costs n·k² once and the solve is independent of n;
/// Grams of disjoint row sets add, which is how the nested estimate refits per fold cheaply.
/// </summary>
internal sealed class Gram
{
    public Gram(int size, double[] values)
    {
        ArgumentOutOfRangeException.ThrowIfNotEqual(values.Length, size * size);
        Size = size;
        Values = values;
    }

    public int Size { get; }

    public double[] Values { get; }

    public double this[int i, int j] => Values[(i * Size) + j];

    /// <summary>
    /// The Gram of <c>columns[j] − shift</c> over <paramref name="rows"/> (all rows when null).
    /// With the target as the shift this is the error Gram: on the simplex y − P w = −(P − y 1ᵀ) w,
    /// so the objective is wᵀ E w with no cancellation against yᵀy.
    /// </summary>
    public static Gram Of(IReadOnlyList<double[]> columns, double[]? shift = null, int[]? rows = null) =>
        new(columns.Count, GramKernel.Compute(columns, shift, rows));

    /// <summary>The sum of Grams of the same size, added in the order given (so the result is repeatable).</summary>
    public static Gram Sum(IEnumerable<Gram> parts)
    {
        double[]? sum = null;
        int size = 0;
        foreach (var part in parts)
        {
            if (sum is null)
            {
                size = part.Size;
                sum = (double[])part.Values.Clone();
                continue;
            }

            ArgumentOutOfRangeException.ThrowIfNotEqual(part.Size, size);
            for (int i = 0; i < sum.Length; i++)
            {
                sum[i] += part.Values[i];
            }
        }

        return sum is null ? throw new ArgumentException("no Gram to add", nameof(parts)) : new Gram(size, sum);
    }

    public double MaxDiagonal()
    {
        double max = 0;
        for (int i = 0; i < Size; i++)
        {
            max = Math.Max(max, this[i, i]);
        }

        return max;
    }
}
