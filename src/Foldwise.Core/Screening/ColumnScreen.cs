using System.Collections.Immutable;
using System.Runtime.InteropServices;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Screening;

/// <summary>
/// Drops training columns that cannot help a learner. Numeric columns, testing in order: all missing, constant, too few
/// non-zero cells (missing cells do not count), then a cell-for-cell repeat of an earlier kept column (found by content
/// hash, confirmed cell by cell). Category columns: all missing, a single level without gaps, or nearly all levels unique.
/// </summary>
public static class ColumnScreen
{
    /// <summary>A category column whose distinct levels reach this share of its present cells is dropped as nearly unique.</summary>
    public const double NearlyUniqueShare = 0.9;

    /// <summary>Below this many present cells a column is too short to call nearly unique.</summary>
    public const int NearlyUniqueMinRows = 20;

    /// <param name="columnsDone">Told after every column how many of the numeric columns are screened, and of how many.</param>
    public static ScreeningReport Screen(FeatureTable train, ScreeningOptions options, Action<long, long>? columnsDone = null) =>
        Screen(train, options, ContentHash, columnsDone: columnsDone);

    /// <summary>The same, with the content hash as a seam, so tests can force collisions.</summary>
    internal static ScreeningReport Screen(
        FeatureTable train, ScreeningOptions options, Func<SparseColumn, long> hash, EncodingOptions? encoding = null, Action<long, long>? columnsDone = null)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(options);
        ArgumentOutOfRangeException.ThrowIfNegative(options.MinNonZero);
        var kept = ImmutableArray.CreateBuilder<string>();
        var dropped = ImmutableArray.CreateBuilder<DroppedColumn>();
        var keptByHash = new Dictionary<long, List<int>>();
        var gaps = ImmutableArray.CreateBuilder<ColumnGap>();
        for (int c = 0; c < train.FeatureCount; c++)
        {
            columnsDone?.Invoke(c, train.FeatureCount);
            var column = train.Columns[c];
            string name = train.FeatureNames[c];
            int missing = column.MissingCount;
            if (missing == train.RowCount)
            {
                dropped.Add(new DroppedColumn(name, DropReason.AllMissing));
                continue;
            }

            if (IsConstant(column, train.RowCount))
            {
                dropped.Add(new DroppedColumn(name, DropReason.Constant));
                continue;
            }

            if (column.NonZeroCount - missing < options.MinNonZero)
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
            if (missing > 0)
            {
                gaps.Add(new ColumnGap(name, missing / (double)train.RowCount));
            }
        }

        var categories = ScreenCategories(train, encoding ?? EncodingOptions.Default, dropped);
        return new ScreeningReport(train.FeatureCount + train.CategoryNames.Length, kept.ToImmutable(), dropped.ToImmutable(), categories, gaps.ToImmutable());
    }

    private static ImmutableArray<CategoryNote> ScreenCategories(FeatureTable train, EncodingOptions encoding, ImmutableArray<DroppedColumn>.Builder dropped)
    {
        var notes = ImmutableArray.CreateBuilder<CategoryNote>();
        for (int c = 0; c < train.CategoryNames.Length; c++)
        {
            var column = train.Categories[c];
            string name = train.CategoryNames[c];
            int present = column.PresentCount;
            int distinct = column.Codes.Where(k => k >= 0).Distinct().Count();
            DropReason? reason = present == 0 ? DropReason.AllMissing
                : distinct == 1 && present == train.RowCount ? DropReason.Constant
                : present >= NearlyUniqueMinRows && distinct >= NearlyUniqueShare * present ? DropReason.NearlyUnique
                : null;
            if (reason is { } r)
            {
                dropped.Add(new DroppedColumn(name, r));
                continue;
            }

            notes.Add(new CategoryNote(
                name, distinct, EncodingChoice.LevelsKept(column, encoding), EncodingChoice.For(column, encoding), column.MissingCount / (double)train.RowCount));
        }

        return notes.ToImmutable();
    }

    /// <summary>The table with only the report's kept numeric and category columns, by name and in the report's order.</summary>
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
        var categoryOf = new Dictionary<string, int>(table.CategoryNames.Length, StringComparer.Ordinal);
        for (int i = 0; i < table.CategoryNames.Length; i++)
        {
            categoryOf.TryAdd(table.CategoryNames[i], i);
        }

        var pickedCategories = report.Categories
            .Select(note => categoryOf.TryGetValue(note.Name, out int at)
                ? at
                : throw new InputException(table.Source, $"the table has no category column '{note.Name}', which screening kept"))
            .ToArray();
        return table.WithColumns(picked).WithCategories(pickedCategories);
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
