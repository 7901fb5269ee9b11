using System.Collections.Immutable;

namespace Foldwise.Core.Search;

/// <summary>
/// The blend members whose fold models a search kept, so new rows can be scored later: one file per member beside
/// the store, named by its content's SHA-256.
/// </summary>
public sealed record KeptModels(string SearchId, ImmutableArray<KeptMember> Members, DateTimeOffset Kept)
{
    /// <summary>Every member's file together, in bytes.</summary>
    public long Bytes => Members.Sum(m => m.Bytes);

    /// <summary>The largest difference of any member's re-fit from the search's test predictions.</summary>
    public double LargestDifference => Members.IsDefaultOrEmpty ? 0 : Members.Max(m => m.Difference);
}
