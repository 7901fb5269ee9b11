using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>
/// A loaded table: row ids, named float features stored column-wise and sparsely
/// (mostly-zero tables stay small; a missing cell is a stored NaN), named category columns beside them,
/// and the target on the original scale when the table has one.
/// </summary>
public sealed class FeatureTable
{
    public FeatureTable(
        string source,
        ImmutableArray<string> ids,
        ImmutableArray<string> featureNames,
        ImmutableArray<SparseColumn> columns,
        ImmutableArray<double> target,
        ImmutableArray<string> categoryNames = default,
        ImmutableArray<CategoryColumn> categories = default)
    {
        categoryNames = categoryNames.IsDefault ? [] : categoryNames;
        categories = categories.IsDefault ? [] : categories;
        if (categoryNames.Length != categories.Length || categories.Any(c => c.Codes.Length != ids.Length))
        {
            throw new ArgumentException("every category name needs exactly one column of one code per row", nameof(categories));
        }

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
        CategoryNames = categoryNames;
        Categories = categories;
    }

    /// <summary>Where the table came from (a file path), for error messages.</summary>
    public string Source { get; }

    public ImmutableArray<string> Ids { get; }

    public ImmutableArray<string> FeatureNames { get; }

    public ImmutableArray<SparseColumn> Columns { get; }

    /// <summary>Category columns by name, beside the numeric features; encoded inside each fold.</summary>
    public ImmutableArray<string> CategoryNames { get; }

    public ImmutableArray<CategoryColumn> Categories { get; }

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

    /// <summary>The same rows with only the given numeric columns, in the given order; category columns unchanged.</summary>
    public FeatureTable WithColumns(IReadOnlyList<int> columnIndices) => new(
        Source,
        Ids,
        [.. columnIndices.Select(i => FeatureNames[i])],
        [.. columnIndices.Select(i => Columns[i])],
        Target,
        CategoryNames,
        Categories);

    /// <summary>The same rows with only the given category columns, in the given order; numeric columns unchanged.</summary>
    public FeatureTable WithCategories(IReadOnlyList<int> categoryIndices) => new(
        Source,
        Ids,
        FeatureNames,
        Columns,
        Target,
        [.. categoryIndices.Select(i => CategoryNames[i])],
        [.. categoryIndices.Select(i => Categories[i])]);

    /// <summary>The features row by row, the form learners read.</summary>
    public SparseRowMatrix ToRows() => SparseRowMatrix.FromColumns(RowCount, Columns);
}
