using Foldwise.Core.Data;

namespace Foldwise.Core.Encodings;

/// <summary>
/// Up to one new cell per row and encoded column group, appended after a matrix's own columns; a zero value is no cell.
/// Groups are filled in column order, so each row's new cells stay ascending.
/// </summary>
internal sealed class ExtraCells(int rowCount, int groups)
{
    private readonly int[] columns = new int[rowCount * groups];
    private readonly float[] values = new float[rowCount * groups];

    public void Set(int row, int group, int column, float value)
    {
        columns[(row * groups) + group] = column;
        values[(row * groups) + group] = value;
    }

    /// <summary>A new matrix: each row's own cells, then its new non-zero cells; <paramref name="width"/> columns in all.</summary>
    public SparseRowMatrix AppendTo(SparseRowMatrix matrix, int width)
    {
        var starts = new int[rowCount + 1];
        for (int r = 0; r < rowCount; r++)
        {
            int added = 0;
            for (int g = 0; g < groups; g++)
            {
                added += values[(r * groups) + g] != 0f ? 1 : 0;
            }

            starts[r + 1] = starts[r] + matrix.RowColumns(r).Length + added;
        }

        var indices = new int[starts[rowCount]];
        var cells = new float[starts[rowCount]];
        for (int r = 0; r < rowCount; r++)
        {
            int at = starts[r];
            matrix.RowColumns(r).CopyTo(indices.AsSpan(at));
            matrix.RowValues(r).CopyTo(cells.AsSpan(at));
            at += matrix.RowColumns(r).Length;
            for (int g = 0; g < groups; g++)
            {
                int k = (r * groups) + g;
                if (values[k] != 0f)
                {
                    indices[at] = columns[k];
                    cells[at++] = values[k];
                }
            }
        }

        return new SparseRowMatrix(rowCount, width, starts, indices, cells);
    }
}
