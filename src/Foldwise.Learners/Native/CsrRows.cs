using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Learners.Native;

/// <summary>Rows in compressed sparse row form, as LightGBM's C API reads them (32-bit starts and columns, 32-bit values).</summary>
internal sealed record CsrRows(int[] RowStarts, int[] Columns, float[] Values, int ColumnCount)
{
    public int RowCount => RowStarts.Length - 1;

    /// <summary>The whole matrix, without copying.</summary>
    public static CsrRows All(SparseRowMatrix matrix) => new(matrix.RowStarts, matrix.ColumnIndices, matrix.Values, matrix.ColumnCount);

    /// <summary>The chosen rows in the given order, copied.</summary>
    public static CsrRows Select(SparseRowMatrix matrix, ImmutableArray<int> rows)
    {
        var starts = new int[rows.Length + 1];
        for (int i = 0; i < rows.Length; i++)
        {
            starts[i + 1] = starts[i] + matrix.RowColumns(rows[i]).Length;
        }

        var columns = new int[starts[^1]];
        var values = new float[starts[^1]];
        for (int i = 0; i < rows.Length; i++)
        {
            matrix.RowColumns(rows[i]).CopyTo(columns.AsSpan(starts[i]));
            matrix.RowValues(rows[i]).CopyTo(values.AsSpan(starts[i]));
        }

        return new CsrRows(starts, columns, values, matrix.ColumnCount);
    }
}
