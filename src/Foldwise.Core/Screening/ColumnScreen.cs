using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;

namespace Foldwise.Core.Screening;

/// <summary>
/// Drops training columns that cannot help a learner, testing in order: constant, too few non-zero cells,
/// then a cell-for-cell repeat of an earlier kept column (found by content hash, confirmed cell by cell).
/// </summary>
public static class ColumnScreen
{
    public static ScreeningReport Screen(FeatureTable train, ScreeningOptions options) =>
        Screen(train, options, ContentHash);

    /// <summary>The same, with the content hash as a seam, so tests can force collisions.</summary>
    internal static ScreeningReport Screen(FeatureTable train, ScreeningOptions options, Func<SparseColumn, long> hash)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentOutOfRangeException.ThrowIfNegative(options.MinNonZero);
        var kept = ImmutableArray.CreateBuilder<string>();
        var dropped = ImmutableArray.CreateBuilder<DroppedColumn>();
        var keptByHash = new Dictionary<long, List<int>>();
        for (int c = 0; c < train.FeatureCount; c++)
        {
            var column = train.Columns[c];
            string name = train.FeatureNames[c];
            if (IsConstant(column, train.RowCount))
            {
                dropped.Add(new DroppedColumn(name, DropReason.Constant));
                continue;
            }

            if (column.NonZeroCount < options.MinNonZero)
            {
                dropped.Add(new DroppedColumn(name, DropReason.TooFewNonZero));
                continue;
            }

            ref var sameHash = ref CollectionsMarshal.GetValueRefOrAddDefault(keptByHash, hash(column), out _);
            sameHash ??= [];
            int twin = sameHash.FindIndex(k => SameCells(train.Columns[k], column));
            if (twin >= 0)
            {
                dropped.Add(new DroppedColumn(name, DropReason.Duplicate, train.FeatureNames[sameHash[twin]]));
                continue;
            }

            sameHash.Add(c);
            kept.Add(name);
        }

        return new ScreeningReport(train.FeatureCount, kept.ToImmutable(), dropped.ToImmutable());
    }

    /// <summary>The table with only the report's kept columns, by name and in the report's order.</summary>
    public static FeatureTable Apply(ScreeningReport report, FeatureTable table)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(table);
        var indexOf = new Dictionary<string, int>(table.FeatureCount, StringComparer.Ordinal);
        for (int i = 0; i < table.FeatureCount; i++)
        {
            indexOf.TryAdd(table.FeatureNames[i], i);
        }

        var picked = report.Kept
            .Select(name => indexOf.TryGetValue(name, out int at)
                ? at
                : throw new InputException(table.Source, $"the table has no column '{name}', which screening kept"))
            .ToArray();
        return table.WithColumns(picked);
    }

    /// <summary>All cells equal: all zero, or every row holding the same non-zero value.</summary>
    private static bool IsConstant(SparseColumn column, int rowCount)
    {
        if (column.NonZeroCount == 0)
        {
            return true;
        }

        if (column.NonZeroCount < rowCount)
        {
            return false;
        }

        var values = column.Values.AsSpan();
        return !values.ContainsAnyExcept(values[0]);
    }

    private static bool SameCells(SparseColumn a, SparseColumn b) =>
        a.Rows.AsSpan().SequenceEqual(b.Rows.AsSpan()) && a.Values.AsSpan().SequenceEqual(b.Values.AsSpan());

    private static long ContentHash(SparseColumn column)
    {
        var hash = default(HashCode);
        hash.AddBytes(MemoryMarshal.AsBytes(column.Rows.AsSpan()));
        hash.AddBytes(MemoryMarshal.AsBytes(column.Values.AsSpan()));
        return hash.ToHashCode();
    }
}
