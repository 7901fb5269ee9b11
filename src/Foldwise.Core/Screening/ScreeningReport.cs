using System.Collections.Immutable;

namespace Foldwise.Core.Screening;

/// <summary>What screening read, kept and dropped (and why), as stored with the search and printed to the user.</summary>
/// <param name="Kept">Kept numeric columns, in order.</param>
/// <param name="Categories">Kept category columns, in order, with their levels and encoding.</param>
/// <param name="Gaps">Kept numeric columns that have missing cells.</param>
public sealed record ScreeningReport(
    int ColumnsRead,
    ImmutableArray<string> Kept,
    ImmutableArray<DroppedColumn> Dropped,
    ImmutableArray<CategoryNote> Categories = default,
    ImmutableArray<ColumnGap> Gaps = default)
{
    public ImmutableArray<CategoryNote> Categories { get; init; } = Categories.IsDefault ? [] : Categories;

    public ImmutableArray<ColumnGap> Gaps { get; init; } = Gaps.IsDefault ? [] : Gaps;

    public int Count(DropReason reason) => Dropped.Count(d => d.Reason == reason);
}
