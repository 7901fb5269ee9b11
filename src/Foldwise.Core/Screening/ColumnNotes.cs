using System.Globalization;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Screening;

/// <summary>
/// One sentence per kept category column (levels kept, encoding, missing share, new test levels) and per numeric column
/// with gaps (share missing), as the run summary and <c>show</c> print them. The report lays out the same facts as a table.
/// </summary>
public static class ColumnNotes
{
    /// <summary>At most this many numeric columns with gaps are named; the rest are counted.</summary>
    public const int GapsNamed = 10;

    public static IEnumerable<string> Lines(ScreeningReport report)
    {
        ArgumentNullException.ThrowIfNull(report);
        foreach (var note in report.Categories)
        {
            yield return Category(note);
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

    public static string Category(CategoryNote note)
    {
        ArgumentNullException.ThrowIfNull(note);
        string encoding = note.Encoding == CategoryEncodingKind.Indicators
            ? "one indicator column per kept level"
            : "smoothed target mean, out-of-fold within each fold's training rows";
        string missing = note.MissingShare > 0 ? string.Create(CultureInfo.InvariantCulture, $", {note.MissingShare * 100:F1}% missing (a level of its own)") : "";
        string fresh = note.NewTestLevels > 0 ? $"; the test table has {Count(note.NewTestLevels, "new level")} in {Count(note.NewTestRows, "row")} (encoded as \"other\")" : "";
        string kept = note.LevelsKept == note.Levels
            ? "each seen often enough to keep"
            : $"{note.LevelsKept:N0} seen often enough to keep, the rest \"other\"";
        return $"category {note.Name}: {note.Levels:N0} levels, {kept}; {encoding}{missing}{fresh}";
    }

    private static string Count(int count, string noun) => count == 1 ? $"1 {noun}" : $"{count:N0} {noun}s";
}
