using System.Collections.Immutable;
using System.Runtime.CompilerServices;
using Foldwise.Core.Data;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners;

/// <summary>
/// Lazy IDataViews over <see cref="SparseRowMatrix"/> rows in sparse form. Rows are produced on each pass
/// rather than copied, so a view costs nothing until read; the test view is kept per test matrix, so every fold
/// of every trial on a table without category columns scores the same object.
/// </summary>
internal static class SparseViews
{
    // Only used as the host of cached views; training and scoring run in each fit's own context.
    private static readonly MLContext Loader = new(seed: 0);

    private static readonly ConditionalWeakTable<SparseRowMatrix, IDataView> TestViews = [];

    public static IDataView Test(SparseRowMatrix test) =>
        TestViews.GetValue(test, t => Create(Loader, t, AllRows(t.RowCount), labels: null));

    public static IDataView Rows(MLContext ml, SparseRowMatrix matrix, ImmutableArray<int> rows, double[]? labels) =>
        Create(ml, matrix, rows, labels);

    /// <summary>
    /// Every row of <paramref name="matrix"/> as a dense vector (zeros written out), produced on each pass. ML.NET's tree
    /// ensembles find a split's value in a sparse row by a search among its non-zero cells, in a dense one by its index.
    /// </summary>
    public static IDataView Dense(MLContext ml, SparseRowMatrix matrix)
    {
        var schema = SchemaDefinition.Create(typeof(SparseFeatureRow));
        schema[nameof(SparseFeatureRow.Features)].ColumnType = new VectorDataViewType(NumberDataViewType.Single, matrix.ColumnCount);
        return ml.Data.LoadFromEnumerable(EnumerateDense(matrix), schema);
    }

    private static IEnumerable<SparseFeatureRow> EnumerateDense(SparseRowMatrix matrix)
    {
        for (int r = 0; r < matrix.RowCount; r++)
        {
            // Fresh arrays per row: ML.NET may keep a row's buffers beyond the next MoveNext.
            var values = new float[matrix.ColumnCount];
            var columns = matrix.RowColumns(r);
            var cells = matrix.RowValues(r);
            for (int k = 0; k < columns.Length; k++)
            {
                values[columns[k]] = cells[k];
            }

            yield return new SparseFeatureRow { Features = new VBuffer<float>(matrix.ColumnCount, values) };
        }
    }

    private static ImmutableArray<int> AllRows(int count) => [.. Enumerable.Range(0, count)];

    private static IDataView Create(MLContext ml, SparseRowMatrix matrix, ImmutableArray<int> rows, double[]? labels)
    {
        var schema = SchemaDefinition.Create(typeof(SparseFeatureRow));
        schema[nameof(SparseFeatureRow.Features)].ColumnType = new VectorDataViewType(NumberDataViewType.Single, matrix.ColumnCount);
        return ml.Data.LoadFromEnumerable(Enumerate(matrix, rows, labels), schema);
    }

    private static IEnumerable<SparseFeatureRow> Enumerate(SparseRowMatrix matrix, ImmutableArray<int> rows, double[]? labels)
    {
        foreach (int r in rows)
        {
            // Fresh arrays per row: ML.NET may keep a row's buffers beyond the next MoveNext.
            var columns = matrix.RowColumns(r);
            yield return new SparseFeatureRow
            {
                Label = labels is null ? 0f : (float)labels[r],
                Features = new VBuffer<float>(matrix.ColumnCount, columns.Length, matrix.RowValues(r).ToArray(), columns.ToArray()),
            };
        }
    }
}
