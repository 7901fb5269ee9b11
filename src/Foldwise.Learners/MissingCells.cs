using Foldwise.Core.Data;
using Foldwise.Core.Learning;

namespace Foldwise.Learners;

/// <summary>Refuses a fold whose training or test table holds a missing (NaN) cell, for families that cannot take one.</summary>
internal static class MissingCells
{
    public static void Refuse(string family, FoldJob job)
    {
        if (First(job.Data.Train) is { } train)
        {
            throw Refusal(family, job, "training", train);
        }

        if (First(job.Data.Test) is { } test)
        {
            throw Refusal(family, job, "test", test);
        }
    }

    private static (int Row, int Column)? First(SparseRowMatrix table)
    {
        int k = Array.FindIndex(table.Values, float.IsNaN);
        if (k < 0)
        {
            return null;
        }

        int row = Array.FindLastIndex(table.RowStarts, s => s <= k);
        return (row, table.ColumnIndices[k]);
    }

    private static ArgumentException Refusal(string family, FoldJob job, string which, (int Row, int Column) cell) =>
        new($"{family} fold {job.Fold} refused: the {which} table has missing cells (first at row {cell.Row + 1}, feature {cell.Column + 1}); " +
            $"{family} cannot fit missing values, leave it out of the search's families or fill the cells", nameof(job));
}
