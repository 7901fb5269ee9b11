namespace Foldwise.Core.Definition;

/// <summary>Suggests the known name a mistyped one was probably meant to be.</summary>
internal static class NearestName
{
    /// <summary>
    /// The closest known name by edit distance (a swap of two neighbours counts once), ignoring case,
    /// or null when none is within 2 edits and under half the name's length.
    /// </summary>
    public static string? Find(string typed, IEnumerable<string> known)
    {
        string? best = null;
        int bestDistance = int.MaxValue;
        foreach (string name in known)
        {
            int d = Distance(typed.ToLowerInvariant(), name.ToLowerInvariant());
            if (d < bestDistance)
            {
                (best, bestDistance) = (name, d);
            }
        }

        return bestDistance <= 2 && bestDistance * 2 < Math.Max(typed.Length, 2) ? best : null;
    }

    // Optimal string alignment distance (Damerau–Levenshtein without repeated edits of one substring).
    internal static int Distance(string a, string b)
    {
        var d = new int[a.Length + 1, b.Length + 1];
        for (int i = 0; i <= a.Length; i++)
        {
            d[i, 0] = i;
        }

        for (int j = 0; j <= b.Length; j++)
        {
            d[0, j] = j;
        }

        for (int i = 1; i <= a.Length; i++)
        {
            for (int j = 1; j <= b.Length; j++)
            {
                int cost = a[i - 1] == b[j - 1] ? 0 : 1;
                d[i, j] = Math.Min(Math.Min(d[i - 1, j] + 1, d[i, j - 1] + 1), d[i - 1, j - 1] + cost);
                if (i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1])
                {
                    d[i, j] = Math.Min(d[i, j], d[i - 2, j - 2] + 1);
                }
            }
        }

        return d[a.Length, b.Length];
    }
}
