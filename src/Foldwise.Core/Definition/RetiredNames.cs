namespace Foldwise.Core.Definition;

/// <summary>
/// Names that earlier versions of the definition syntax and the command line used, each with the name that
/// replaced it. Edit distance cannot lead from one to the other (<c>min_rounds</c> is nowhere near
/// <c>first_rung</c>), so a refused name is looked up here before the nearest-name search.
/// </summary>
public static class RetiredNames
{
    private static readonly Dictionary<string, string> Replacements = new(StringComparer.Ordinal)
    {
        // Definition keys of schedule.
        ["min_rounds"] = "first_rung",
        ["max_rounds"] = "full_budget",

        // Definition range words (log keeps its name).
        ["int"] = "whole",
        ["float"] = "linear",
        ["choice"] = "one_of",

        // The blend mode word of the command line, now spelled as in the definition.
        ["nonneg"] = "non_negative",

        // Options of foldwise plan.
        ["--min-budget"] = "--first-rung",
        ["--max-budget"] = "--full-budget",
    };

    /// <summary>The name that replaced <paramref name="name"/>, or null when it was never retired.</summary>
    public static string? ReplacementOf(string name) => Replacements.GetValueOrDefault(name);

    /// <summary>Every retired name, for a command line that refuses them before it parses.</summary>
    public static IEnumerable<string> All => Replacements.Keys;
}
