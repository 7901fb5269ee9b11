namespace Foldwise.Core.Spaces;

/// <summary>The built-in families' names, for code that names one family on purpose; what a family is lives in <see cref="FamilyDescriptors"/>.</summary>
public static class FamilyNames
{
    public const string LightGbm = "lightgbm";
    public const string FastTree = "fasttree";
    public const string Forest = "forest";
    public const string Gam = "gam";
    public const string Linear = "linear";

    /// <summary>Every family a definition may name (<see cref="FamilyDescriptors.All"/>).</summary>
    public static IReadOnlyList<string> All { get; } = [.. FamilyDescriptors.All.Select(d => d.Name)];

    /// <summary>The families a search without <c>families</c> runs: those whose descriptor says so.</summary>
    public static IReadOnlyList<string> Default { get; } = [.. FamilyDescriptors.All.Where(d => d.InDefaultSet).Select(d => d.Name)];
}
