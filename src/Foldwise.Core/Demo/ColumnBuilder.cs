using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Core.Demo;

/// <summary>Collects cells row by row (rows ascending) into sparse columns.</summary>
internal sealed class ColumnBuilder(int columnCount)
{
    private readonly List<int>[] rows = [.. Enumerable.Range(0, columnCount).Select(_ => new List<int>())];
    private readonly List<float>[] values = [.. Enumerable.Range(0, columnCount).Select(_ => new List<float>())];

    public void Add(int row, int column, float value)
    {
        rows[column].Add(row);
        values[column].Add(value);
    }

    public SparseColumn Build(int column) => rows[column].Count == 0
        ? SparseColumn.Empty
        : new SparseColumn([.. rows[column]], [.. values[column]]);

    public ImmutableArray<SparseColumn> BuildAll() => [.. Enumerable.Range(0, rows.Length).Select(Build)];
}
