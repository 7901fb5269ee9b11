using System.Collections.Immutable;

namespace Foldwise.Core.Screening;

/// <summary>What screening read, kept and dropped (and why), as stored with the search and printed to the user.</summary>
public sealed record ScreeningReport(int ColumnsRead, ImmutableArray<string> Kept, ImmutableArray<DroppedColumn> Dropped)
{
    public int Count(DropReason reason) => Dropped.Count(d => d.Reason == reason);
}
