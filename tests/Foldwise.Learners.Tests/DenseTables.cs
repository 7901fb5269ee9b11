using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;

namespace Foldwise.Learners.Tests;

/// <summary>Trial data from dense rows, with the target already on the fitting scale.</summary>
internal static class DenseTables
{
    public static SparseRowMatrix Matrix(double[][] rows)
    {
        int columns = rows.Length == 0 ? 0 : rows[0].Length;
        var starts = new List<int> { 0 };
        var indices = new List<int>();
        var values = new List<float>();
        foreach (var row in rows)
        {
            for (int c = 0; c < columns; c++)
            {
                if (row[c] != 0)
                {
                    indices.Add(c);
                    values.Add((float)row[c]);
                }
            }

            starts.Add(values.Count);
        }

        return new SparseRowMatrix(rows.Length, columns, [.. starts], [.. indices], [.. values]);
    }

    public static TrialData Data(double[][] train, double[] target, double[][] test, int[] foldOfRow) =>
        new(Matrix(train), target, Matrix(test), new FoldPlan(foldOfRow.Max() + 1, 0, [.. foldOfRow]), Metric.Rmsle);
}
