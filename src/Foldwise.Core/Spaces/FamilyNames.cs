namespace Foldwise.Core.Spaces;

/// <summary>The built-in learner families. Workers run only these; the coordinator sends names and parameters, never code.</summary>
public static class FamilyNames
{
    public const string LightGbm = "lightgbm";
    public const string FastTree = "fasttree";
    public const string Forest = "forest";
    public const string Gam = "gam";
    public const string Linear = "linear";

    /// <summary>Every family a definition may name.</summary>
    public static IReadOnlyList<string> All { get; } = [LightGbm, FastTree, Forest, Gam, Linear];

    /// <summary>
    /// The families a search without <c>families</c> runs. Forest, GAM and linear join once each family has a budget
    /// range of its own: under the shared rounds range a forest trial costs many boosted ones.
    /// </summary>
    public static IReadOnlyList<string> Default { get; } = [LightGbm, FastTree];
}
