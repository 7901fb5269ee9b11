using System.Collections.Immutable;
using System.Runtime.CompilerServices;
using Foldwise.Core.Data;
using Foldwise.Core.Learning;
using Microsoft.ML;
using Microsoft.ML.Data;

namespace Foldwise.Learners;

/// <summary>
/// Lazy IDataViews over <see cref="SparseRowMatrix"/> rows in sparse form. Rows are produced on each pass
/// rather than copied, so a view costs nothing until read; the test view is kept per <see cref="TrialData"/>
/// so every fold of every trial on that data scores the same object.
/// </summary>
internal static class SparseViews
{
    // Only used as the host of cached views; training and scoring run in each fit's own context.
    private static readonly MLContext Loader = new(seed: 0);

    private static readonly ConditionalWeakTable<TrialData, IDataView> TestViews = [];

    public static IDataView Test(TrialData data) =>
        TestViews.GetValue(data, d => Create(Loader, d.Test, AllRows(d.Test.RowCount), labels: null));

    public static IDataView Rows(MLContext ml, SparseRowMatrix matrix, ImmutableArray<int> rows, double[]? labels) =>
        Create(ml, matrix, rows, labels);

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
