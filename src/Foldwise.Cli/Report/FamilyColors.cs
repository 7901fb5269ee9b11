using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>One fixed colour per family across every chart of a report (a colour-blind-safe set; the first two are the built-in families).</summary>
public static class FamilyColors
{
    // Okabe–Ito palette — Okabe & Ito, "Color Universal Design", 2008.
    private static readonly string[] Hex = ["#0072B2", "#E69F00", "#009E73", "#CC79A7", "#56B4E9", "#D55E00", "#F0E442", "#000000"];

    public static Color For(IReadOnlyList<string> families, string family)
    {
        int i = Math.Max(0, families.ToList().IndexOf(family));
        return Color.FromHex(Hex[i % Hex.Length]);
    }

    public static string HexFor(IReadOnlyList<string> families, string family) =>
        Hex[Math.Max(0, families.ToList().IndexOf(family)) % Hex.Length];
}
