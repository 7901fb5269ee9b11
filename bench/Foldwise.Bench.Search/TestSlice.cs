using Foldwise.Core.Data;
using Foldwise.Core.Learning;

/// <summary>
/// The first rows of a trial's test table, with their category codes cut to match: test predictions are part of
/// every trial but not of the comparison, so a short slice keeps them cheap.
/// </summary>
internal static class TestSlice
{
    public static TrialData First(TrialData data, int rows)
    {
        var test = data.Test;
        if (test.RowCount <= rows)
        {
            return data;
        }

        int cells = test.RowStarts[rows];
        var slice = new SparseRowMatrix(rows, test.ColumnCount, test.RowStarts[..(rows + 1)], test.ColumnIndices[..cells], test.Values[..cells]);
        var categories = data.Categories.IsDefault ? data.Categories : [.. data.Categories.Select(c => c with { Test = c.Test[..rows] })];
        return data with { Test = slice, Categories = categories };
    }
}
