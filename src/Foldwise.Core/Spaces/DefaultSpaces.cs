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

    /// <summary>
    /// ML.NET's FastForest: each tree fits a sample of <c>row_fraction</c> of the rows and splits on a share
    /// <c>feature_fraction</c> of the columns; forests want deep trees, hence more and smaller leaves than boosting
    /// (common practice), and a row fraction below 1 so that the trees differ.
    /// </summary>
    public static ParameterSpace Forest { get; } = new(
    [
        ParameterRange.Whole("leaves", 16, 128),
        ParameterRange.Whole("min_leaf_rows", 2, 50),
        ParameterRange.Linear("feature_fraction", 0.1, 1.0),
        ParameterRange.Linear("row_fraction", 0.4, 0.9),
    ]);

    /// <summary>
    /// ML.NET's GAM (one shallow tree per feature and iteration). ML.NET's own default rate is 0.002 over 9,500
    /// iterations; the searched budgets are far shorter, so the rates are higher.
    /// </summary>
    public static ParameterSpace Gam { get; } = new(
    [
        ParameterRange.Log("learning_rate", 0.005, 0.2),
        ParameterRange.Whole("min_leaf_rows", 5, 100),
        ParameterRange.Whole("bins", 16, 255),
    ]);

    /// <summary>
    /// ML.NET's SDCA ridge regression on fold-prepared inputs; <c>l2</c> is the penalty of its objective
    /// (1/n)·Σ(ŷ−y)² + (l2/2)·‖w‖², i.e. scikit-learn's Ridge alpha = n·l2/2 (LinearReferenceTests pins it).
    /// </summary>
    public static ParameterSpace Linear { get; } = new(
    [
        ParameterRange.Log("l2", 1e-4, 10),
    ]);

    public static ParameterSpace For(string family) => family switch
    {
        FamilyNames.LightGbm => LightGbm,
        FamilyNames.FastTree => FastTree,
        FamilyNames.Forest => Forest,
        FamilyNames.Gam => Gam,
        FamilyNames.Linear => Linear,
        _ => throw new ArgumentException($"unknown family '{family}'; built-in families are {string.Join(", ", FamilyNames.All)}", nameof(family)),
    };
}
