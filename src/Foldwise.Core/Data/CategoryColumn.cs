using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>
/// One category column: its level names in order of first appearance, and each row's level as an index into
/// <see cref="Levels"/>, or <see cref="Missing"/> for a missing cell.
/// </summary>
public sealed record CategoryColumn(ImmutableArray<string> Levels, ImmutableArray<int> Codes)
{
    /// <summary>The code of a missing cell.</summary>
    public const int Missing = -1;

    /// <summary>How many rows hold a level (not missing).</summary>
    public int PresentCount => Codes.Length - MissingCount;

    public int MissingCount => Codes.AsSpan().Count(Missing);
}
