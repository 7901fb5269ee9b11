namespace Foldwise.Core.Spaces;

/// <summary>The built-in learner families. Workers run only these; the coordinator sends names and parameters, never code.</summary>
public static class FamilyNames
{
    public const string LightGbm = "lightgbm";
    public const string FastTree = "fasttree";
    public const string Forest = "forest";
    public const string Gam = "gam";
    public const string Linear = "linear";

    public static IReadOnlyList<string> All { get; } = [LightGbm, FastTree, Forest, Gam, Linear];
}
