using System.Collections.Immutable;

namespace Foldwise.Core.Data;

/// <summary>
/// How cells are read: which words mean a missing cell (compared ignoring case; an empty cell is always missing),
/// which numeric-looking columns are categories, and which columns are not read at all.
/// The default missing words are <c>NA</c>, <c>N/A</c>, <c>NaN</c> and <c>null</c>.
/// </summary>
/// <param name="MissingWordsStated">True when the definition listed the words itself: then a column holding both
/// empty cells and a missing word is taken at its word; with the default list it is refused as ambiguous.</param>
public sealed record TableRules(
    ImmutableArray<string> MissingWords,
    bool MissingWordsStated,
    ImmutableArray<string> Categories,
    ImmutableArray<string> Ignored)
{
    public static ImmutableArray<string> DefaultMissingWords { get; } = ["NA", "N/A", "NaN", "null"];

    /// <summary>The default missing words, no declared categories, nothing ignored.</summary>
    public static TableRules Default { get; } = new(DefaultMissingWords, false, [], []);

    public bool Equals(TableRules? other) =>
        other is not null && MissingWordsStated == other.MissingWordsStated &&
        MissingWords.SequenceEqual(other.MissingWords) && Categories.SequenceEqual(other.Categories) && Ignored.SequenceEqual(other.Ignored);

    public override int GetHashCode() => HashCode.Combine(MissingWordsStated, MissingWords.Length, Categories.Length, Ignored.Length);

    /// <summary>True when the cell is empty or, ignoring case, one of <see cref="MissingWords"/>.</summary>
    public bool IsMissing(ReadOnlySpan<char> cell)
    {
        if (cell.IsEmpty)
        {
            return true;
        }

        foreach (string word in MissingWords)
        {
            if (word.Length == cell.Length && cell.Equals(word, StringComparison.OrdinalIgnoreCase))
            {
                return true;
            }
        }

        return false;
    }
}
