using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>
/// A loaded table: row ids, named float features stored column-wise and sparsely
/// (mostly-zero tables stay small), and the target on the original scale when the table has one.
/// </summary>
public sealed class FeatureTable
{
    public FeatureTable(
        string source,
        ImmutableArray<string> ids,
        ImmutableArray<string> featureNames,
        ImmutableArray<SparseColumn> columns,
        ImmutableArray<double> target)
    {
        if (featureNames.Length != columns.Length)
        {
            throw new ArgumentException("every feature needs exactly one column", nameof(columns));
        }

        if (!target.IsDefaultOrEmpty && target.Length != ids.Length)
        {
            throw new ArgumentException("the target needs one value per row", nameof(target));
        }

        Source = source;
        Ids = ids;
        FeatureNames = featureNames;
        Columns = columns;
        Target = target.IsDefault ? [] : target;
    }

    /// <summary>Where the table came from (a file path), for error messages.</summary>
    public string Source { get; }

    public ImmutableArray<string> Ids { get; }

    public ImmutableArray<string> FeatureNames { get; }

    public ImmutableArray<SparseColumn> Columns { get; }

    /// <summary>The target on the original scale; empty for a table without one (a test table).</summary>
    public ImmutableArray<double> Target { get; }

    public int RowCount => Ids.Length;

    public int FeatureCount => FeatureNames.Length;

    public bool HasTarget => !Target.IsEmpty;

    /// <summary>Non-zero cells over all cells; 0 for an empty table.</summary>
    public double Density
    {
        get
        {
            long cells = (long)RowCount * FeatureCount;
            return cells == 0 ? 0 : Columns.Sum(c => (long)c.NonZeroCount) / (double)cells;
        }
    }

    /// <summary>The same rows with only the given columns, in the given order.</summary>
    public FeatureTable WithColumns(IReadOnlyList<int> columnIndices) => new(
        Source,
        Ids,
        [.. columnIndices.Select(i => FeatureNames[i])],
        [.. columnIndices.Select(i => Columns[i])],
        Target);

    /// <summary>The features row by row, the form learners read.</summary>
    public SparseRowMatrix ToRows() => SparseRowMatrix.FromColumns(RowCount, Columns);
}
