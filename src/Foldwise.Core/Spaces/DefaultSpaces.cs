namespace Foldwise.Core.Spaces;

/// <summary>
/// Each built-in family's searchable parameters and their default ranges: the one place a search
/// without its own ranges takes them from. Names are the project's; each learner maps them to
/// its library's options in one table.
/// </summary>
public static class DefaultSpaces
{
    /// <summary>Ranges are common practice for gradient-boosted trees on a few thousand wide, sparse rows.</summary>
    public static ParameterSpace LightGbm { get; } = new(
    [
        ParameterRange.Log("learning_rate", 0.01, 0.3),
        ParameterRange.Whole("leaves", 8, 128),
        ParameterRange.Whole("min_leaf_rows", 5, 100),
        ParameterRange.Linear("feature_fraction", 0.1, 1.0),
        ParameterRange.Linear("row_fraction", 0.5, 1.0),
        ParameterRange.Log("l2", 1e-3, 10),
    ]);

    /// <summary>The same shape for ML.NET's FastTree, which has no L2 term on leaves.</summary>
    public static ParameterSpace FastTree { get; } = new(
    [
        ParameterRange.Log("learning_rate", 0.01, 0.3),
        ParameterRange.Whole("leaves", 8, 128),
        ParameterRange.Whole("min_leaf_rows", 5, 100),
        ParameterRange.Linear("feature_fraction", 0.1, 1.0),
        ParameterRange.Linear("row_fraction", 0.5, 1.0),
    ]);

    public static ParameterSpace For(string family) => family switch
    {
        FamilyNames.LightGbm => LightGbm,
        FamilyNames.FastTree => FastTree,
        _ => throw new ArgumentException($"unknown family '{family}'; built-in families are {string.Join(", ", FamilyNames.All)}", nameof(family)),
    };
}
