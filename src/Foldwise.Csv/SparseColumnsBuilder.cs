using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>
/// Collects the non-zero cells of every column as rows arrive. Each column owns two growable arrays,
/// so a cell costs 8 bytes and no allocation of its own.
/// </summary>
internal sealed class SparseColumnsBuilder
{
    private const int FirstCapacity = 16;

    private readonly int[][] rows;
    private readonly float[][] values;
    private readonly int[] counts;

    public SparseColumnsBuilder(int columnCount)
    {
        rows = new int[columnCount][];
        values = new float[columnCount][];
        counts = new int[columnCount];
        Array.Fill(rows, []);
        Array.Fill(values, []);
    }

    /// <summary>Adds a non-zero cell; rows must arrive in ascending order.</summary>
    public void Add(int column, int row, float value)
    {
        int n = counts[column];
        if (n == rows[column].Length)
        {
            int capacity = Math.Max(FirstCapacity, n * 2);
            Array.Resize(ref rows[column], capacity);
            Array.Resize(ref values[column], capacity);
        }

        rows[column][n] = row;
        values[column][n] = value;
        counts[column] = n + 1;
    }

    public ReadOnlySpan<int> Rows(int column) => rows[column].AsSpan(0, counts[column]);

    public ReadOnlySpan<float> Values(int column) => values[column].AsSpan(0, counts[column]);

    /// <summary>Empties a column that turned out to hold text, releasing its buffers.</summary>
    public void Clear(int column)
    {
        rows[column] = [];
        values[column] = [];
        counts[column] = 0;
    }

    /// <summary>Trims every column to its size, releasing each growth buffer as soon as it is copied.</summary>
    public ImmutableArray<SparseColumn> Build()
    {
        var columns = new SparseColumn[counts.Length];
        for (int c = 0; c < columns.Length; c++)
        {
            int n = counts[c];
            columns[c] = n == 0
                ? SparseColumn.Empty
                : new SparseColumn(
                    ImmutableCollectionsMarshal.AsImmutableArray(rows[c].AsSpan(0, n).ToArray()),
                    ImmutableCollectionsMarshal.AsImmutableArray(values[c].AsSpan(0, n).ToArray()));
            rows[c] = [];
            values[c] = [];
        }

        return ImmutableCollectionsMarshal.AsImmutableArray(columns);
    }
}
