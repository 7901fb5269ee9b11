using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Learning;

namespace Foldwise.Core.Encodings;

/// <summary>
/// Fills missing cells for families that cannot take NaN: each column's median over the fold's training rows (zeros
/// included, missing cells not), plus a 0/1 "was missing" column, after all others, for each column with a missing
/// cell among those rows. A column missing only outside those rows is filled but gains no such column.
/// </summary>
internal static class MedianImputation
{
    public static FoldInputs Apply(FoldInputs inputs, ImmutableArray<int> trainRows)
    {
        int width = inputs.ColumnCount;
        var present = new List<float>?[width];
        var missingInTrain = new int[width];
        var train = inputs.Train;
        var gap = new bool[width];
        MarkGaps(train, gap);
        MarkGaps(inputs.Test, gap);
        foreach (int row in trainRows)
        {
            var columns = train.RowColumns(row);
            var values = train.RowValues(row);
            for (int k = 0; k < columns.Length; k++)
            {
                if (!gap[columns[k]])
                {
                    continue;
                }

                if (float.IsNaN(values[k]))
                {
                    missingInTrain[columns[k]]++;
                }
                else
                {
                    (present[columns[k]] ??= []).Add(values[k]);
                }
            }
        }

        var flagOf = new int[width];
        int next = width;
        for (int c = 0; c < width; c++)
        {
            flagOf[c] = missingInTrain[c] > 0 ? next++ : -1;
        }

        var median = new float[width];
        for (int c = 0; c < width; c++)
        {
            median[c] = gap[c] ? Median(present[c], trainRows.Length - missingInTrain[c]) : 0f;
        }

        return new FoldInputs(Fill(train, median, flagOf, next), Fill(inputs.Test, median, flagOf, next)) { LevelCodeColumns = inputs.LevelCodeColumns };
    }

    /// <summary>The median of <paramref name="nonZero"/> together with enough zeros to make <paramref name="count"/> values.</summary>
    internal static float Median(List<float>? nonZero, int count)
    {
        if (count <= 0)
        {
            return 0f;
        }

        var values = new float[count];
        nonZero?.CopyTo(values);
        Array.Sort(values);
        return count % 2 == 1 ? values[count / 2] : (values[(count / 2) - 1] + values[count / 2]) / 2f;
    }

    private static void MarkGaps(SparseRowMatrix matrix, bool[] gap)
    {
        for (int k = 0; k < matrix.Values.Length; k++)
        {
            if (float.IsNaN(matrix.Values[k]))
            {
                gap[matrix.ColumnIndices[k]] = true;
            }
        }
    }

    private static SparseRowMatrix Fill(SparseRowMatrix matrix, float[] median, int[] flagOf, int width)
    {
        var starts = new int[matrix.RowCount + 1];
        var indices = new List<int>(matrix.ColumnIndices.Length);
        var values = new List<float>(matrix.Values.Length);
        var flags = new List<int>();
        for (int r = 0; r < matrix.RowCount; r++)
        {
            var columns = matrix.RowColumns(r);
            var cells = matrix.RowValues(r);
            flags.Clear();
            for (int k = 0; k < columns.Length; k++)
            {
                float v = cells[k];
                if (float.IsNaN(v))
                {
                    v = median[columns[k]];
                    if (flagOf[columns[k]] >= 0)
                    {
                        flags.Add(flagOf[columns[k]]);
                    }
                }

                if (v != 0f)
                {
                    indices.Add(columns[k]);
                    values.Add(v);
                }
            }

            foreach (int flag in flags)
            {
                indices.Add(flag);
                values.Add(1f);
            }

            starts[r + 1] = indices.Count;
        }

        return new SparseRowMatrix(matrix.RowCount, width, starts, [.. indices], [.. values]);
    }
}
