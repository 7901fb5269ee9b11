namespace Foldwise.Core.Data;

/// <summary>
/// Compressed sparse rows: row r's non-zero cells are <c>ColumnIndices[RowStarts[r]..RowStarts[r+1]]</c>
/// with the matching <c>Values</c>, column indices ascending. Learners build their row views from it.
/// </summary>
public sealed class SparseRowMatrix
{
    public SparseRowMatrix(int rowCount, int columnCount, int[] rowStarts, int[] columnIndices, float[] values)
    {
        if (rowStarts.Length != rowCount + 1 || columnIndices.Length != values.Length || rowStarts[^1] != values.Length)
        {
            throw new ArgumentException("row starts, column indices and values do not agree");
        }

        RowCount = rowCount;
        ColumnCount = columnCount;
        RowStarts = rowStarts;
        ColumnIndices = columnIndices;
        Values = values;
    }

    public int RowCount { get; }

    public int ColumnCount { get; }

    public int[] RowStarts { get; }

    public int[] ColumnIndices { get; }

    public float[] Values { get; }

    public ReadOnlySpan<int> RowColumns(int row) => ColumnIndices.AsSpan(RowStarts[row], RowStarts[row + 1] - RowStarts[row]);

    public ReadOnlySpan<float> RowValues(int row) => Values.AsSpan(RowStarts[row], RowStarts[row + 1] - RowStarts[row]);

    /// <summary>Transposes column-wise storage; a counting pass, then a filling pass.</summary>
    public static SparseRowMatrix FromColumns(int rowCount, IReadOnlyList<SparseColumn> columns)
    {
        var starts = new int[rowCount + 1];
        foreach (var column in columns)
        {
            foreach (int row in column.Rows)
            {
                starts[row + 1]++;
            }
        }

        for (int r = 0; r < rowCount; r++)
        {
            starts[r + 1] += starts[r];
        }

        var cursor = (int[])starts.Clone();
        var indices = new int[starts[rowCount]];
        var values = new float[starts[rowCount]];
        for (int c = 0; c < columns.Count; c++)
        {
            var rows = columns[c].Rows.AsSpan();
            var cells = columns[c].Values.AsSpan();
            for (int k = 0; k < rows.Length; k++)
            {
                int at = cursor[rows[k]]++;
                indices[at] = c;
                values[at] = cells[k];
            }
        }

        return new SparseRowMatrix(rowCount, columns.Count, starts, indices, values);
    }
}
