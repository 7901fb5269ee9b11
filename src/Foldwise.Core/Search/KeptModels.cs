using System.Collections.Immutable;

namespace Foldwise.Core.Search;

/// <summary>
/// The blend members whose fold models a search kept, so new rows can be scored later: one file per member beside
/// the store, named by its content's SHA-256. <see cref="LargestDifference"/> is how far the re-fitted members'
/// test predictions came from the search's own (relative, on the fitting scale).
/// </summary>
public sealed record KeptModels(string SearchId, ImmutableArray<KeptMember> Members, double LargestDifference, DateTimeOffset Kept)
{
    /// <summary>Every member's file together, in bytes.</summary>
    public long Bytes => Members.Sum(m => m.Bytes);
}
