using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Screening;

/// <summary>
/// One sentence per kept category column (levels kept, encoding, missing share, new test levels) and per numeric column
/// with gaps (share missing), as the run summary and <c>show</c> print them. The report lays out the same facts as a table.
/// A few-level column's encoding depends on the family reading it (<see cref="FamilySearch.FewLevelsForm"/>), so the
/// search's families are given.
/// </summary>
public static class ColumnNotes
{
    /// <summary>At most this many numeric columns with gaps are named; the rest are counted.</summary>
    public const int GapsNamed = 10;

    public static IEnumerable<string> Lines(ScreeningReport report, IReadOnlyList<FamilySearch> families)
    {
        ArgumentNullException.ThrowIfNull(report);
        ArgumentNullException.ThrowIfNull(families);
        foreach (var note in report.Categories)
        {
            yield return Category(note, families);
        }

        foreach (var gap in report.Gaps.Take(GapsNamed))
        {
            yield return string.Create(CultureInfo.InvariantCulture, $"{gap.Name}: {gap.MissingShare * 100:F1}% missing, kept as missing (imputed inside each fold for families that cannot take it)");
        }

        if (report.Gaps.Length > GapsNamed)
        {
            yield return $"… and {report.Gaps.Length - GapsNamed:N0} more numeric columns with gaps";
        }
    }

    public static string Category(CategoryNote note, IReadOnlyList<FamilySearch> families)
    {
        ArgumentNullException.ThrowIfNull(note);
        ArgumentNullException.ThrowIfNull(families);
        string encoding = Encoding(note.Encoding, families, Long);
        string missing = note.MissingShare > 0 ? string.Create(CultureInfo.InvariantCulture, $", {note.MissingShare * 100:F1}% missing (a level of its own)") : "";
        string fresh = note.NewTestLevels > 0 ? $"; the test table has {Count(note.NewTestLevels, "new level")} in {Count(note.NewTestRows, "row")} (encoded as \"other\")" : "";
        string kept = note.LevelsKept == note.Levels
            ? "each seen often enough to keep"
            : $"{note.LevelsKept:N0} seen often enough to keep, the rest \"other\"";
        return $"category {note.Name}: {note.Levels:N0} levels, {kept}; {encoding}{missing}{fresh}";
    }

    /// <summary>
    /// The encoding of a column of <paramref name="kind"/> in words (<paramref name="words"/>: long or short forms); a
    /// few-level column read in different forms by different families names the families of each form.
    /// </summary>
    public static string Encoding(CategoryEncodingKind kind, IReadOnlyList<FamilySearch> families, Func<CategoryEncodingKind, string> words)
    {
        ArgumentNullException.ThrowIfNull(families);
        ArgumentNullException.ThrowIfNull(words);
        if (kind != CategoryEncodingKind.Indicators)
        {
            return words(kind);
        }

        var forms = families.GroupBy(f => f.FewLevelsForm).ToList();
        return forms.Count switch
        {
            0 => words(CategoryEncodingKind.Indicators),
            1 => words(forms[0].Key),
            _ => string.Join("; ", forms.Select(g => $"{string.Join(", ", g.Select(f => f.Family))}: {words(g.Key)}")),
        };
    }

    /// <summary>The long form of each encoding, as the summary and <c>show</c> print it.</summary>
    public static string Long(CategoryEncodingKind kind) => kind switch
    {
        CategoryEncodingKind.Indicators => "one indicator column per kept level",
        CategoryEncodingKind.TargetMean => "smoothed target mean, out-of-fold within each fold's training rows",
        CategoryEncodingKind.LevelCodes => "one column of level codes, grouped by LightGBM's own category splits",
        _ => throw new ArgumentOutOfRangeException(nameof(kind), kind, "unknown encoding"),
    };

    private static string Count(int count, string noun) => count == 1 ? $"1 {noun}" : $"{count:N0} {noun}s";
}
