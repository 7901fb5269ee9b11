namespace Foldwise.Core.Encodings;

/// <summary>Counts a category column's levels over chosen rows and maps each level to a kept slot.</summary>
internal static class LevelCounts
{
    /// <summary>Rows per level code over <paramref name="rows"/> (all rows when null); the missing code is counted separately.</summary>
    public static (int[] Counts, int Missing) Of(ReadOnlySpan<int> codes, int levelCount, IReadOnlyList<int>? rows)
    {
        var counts = new int[levelCount];
        int missing = 0;
        int n = rows?.Count ?? codes.Length;
        for (int i = 0; i < n; i++)
        {
            int code = codes[rows is null ? i : rows[i]];
            if (code < 0)
            {
                missing++;
            }
            else
            {
                counts[code]++;
            }
        }

        return (counts, missing);
    }

    /// <summary>How many levels have at least <paramref name="minCount"/> rows.</summary>
    public static int Kept(int[] counts, int minCount) => counts.Count(c => c >= minCount);

    /// <summary>Kept slots of a column: kept levels, plus one for missing and one for "other" when they occur.</summary>
    public static int Slots(int[] counts, int missing, int minCount) =>
        Kept(counts, minCount) + (missing > 0 ? 1 : 0) + (counts.Any(c => c > 0 && c < minCount) ? 1 : 0);
}
