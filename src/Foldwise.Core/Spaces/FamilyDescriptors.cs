using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;

namespace Foldwise.Core.Spaces;

/// <summary>
/// The built-in families, one descriptor each: the one place that says what a family is. Workers run only these;
/// the coordinator sends names and parameters, never code. Parameter ranges are the project's own names; each learner
/// maps them to its library's options in one table.
/// </summary>
public static class FamilyDescriptors
{
    /// <summary>
    /// Native LightGBM. Ranges are common practice for gradient-boosted trees on a few thousand wide, sparse rows. It
    /// reads a few-level category column as one column of level codes and groups levels inside its own splits, or, when
    /// a definition says so, as indicator columns.
    /// </summary>
    public static FamilyDescriptor LightGbm { get; } = new(
        FamilyNames.LightGbm,
        BudgetUnit.Rounds,
        FirstRung: 25,
        FullBudget: 400,
        new ParameterSpace(
        [
            ParameterRange.Log("learning_rate", 0.01, 0.3),
            ParameterRange.Whole("leaves", 8, 128),
            ParameterRange.Whole("min_leaf_rows", 5, 100),
            ParameterRange.Linear("feature_fraction", 0.1, 1.0),
            ParameterRange.Linear("row_fraction", 0.5, 1.0),
            ParameterRange.Log("l2", 1e-3, 10),
        ]),
        FamilyInput.RawWithMissing,
        InDefaultSet: true)
    {
        // Level codes first: on the same folds and settings (bench/Foldwise.Bench.Tables cv, 2026-12-05) they scored OOF
        // RMSLE 0.11361 against 0.11856 for indicators on 2,000 diamonds rows and 0.08653 against 0.08741 on all 53,940;
        // within 0.2 % of indicators on modeldata's stackoverflow table and on the quick demo (README, "Your own tables").
        FewLevelForms = [CategoryEncodingKind.LevelCodes, CategoryEncodingKind.Indicators],
    };

    /// <summary>ML.NET's FastTree: LightGBM's shape without the L2 term on leaves. It skips training rows holding a NaN, so it reads imputed inputs.</summary>
    public static FamilyDescriptor FastTree { get; } = new(
        FamilyNames.FastTree,
        BudgetUnit.Rounds,
        FirstRung: 25,
        FullBudget: 400,
        new ParameterSpace(
        [
            ParameterRange.Log("learning_rate", 0.01, 0.3),
            ParameterRange.Whole("leaves", 8, 128),
            ParameterRange.Whole("min_leaf_rows", 5, 100),
            ParameterRange.Linear("feature_fraction", 0.1, 1.0),
            ParameterRange.Linear("row_fraction", 0.5, 1.0),
        ]),
        FamilyInput.Imputed,
        InDefaultSet: true);

    /// <summary>
    /// ML.NET's FastForest, budget = trees: each tree fits a sample of <c>row_fraction</c> of the rows and splits on a
    /// share <c>feature_fraction</c> of the columns; forests want deep trees, hence more and smaller leaves than
    /// boosting (common practice), and a row fraction below 1 so that the trees differ. Rungs of 20 to 300 trees: a
    /// forest's score settles after a few hundred trees (common practice).
    /// </summary>
    public static FamilyDescriptor Forest { get; } = new(
        FamilyNames.Forest,
        BudgetUnit.Trees,
        FirstRung: 20,
        FullBudget: 300,
        new ParameterSpace(
        [
            ParameterRange.Whole("leaves", 16, 128),
            ParameterRange.Whole("min_leaf_rows", 2, 50),
            ParameterRange.Linear("feature_fraction", 0.1, 1.0),
            ParameterRange.Linear("row_fraction", 0.4, 0.9),
        ]),
        FamilyInput.Imputed,
        InDefaultSet: false);

    /// <summary>
    /// ML.NET's GAM (one shallow tree per feature and iteration), budget = boosting iterations. <c>learning_rate</c> is
    /// the step of a whole iteration, which the learner shares among the features (GamLearner); ML.NET's own default
    /// is 0.002 per feature over 9,500 iterations, and the searched budgets (40 to 1,000) are far shorter.
    /// </summary>
    public static FamilyDescriptor Gam { get; } = new(
        FamilyNames.Gam,
        BudgetUnit.Iterations,
        FirstRung: 40,
        FullBudget: 1000,
        new ParameterSpace(
        [
            ParameterRange.Log("learning_rate", 0.005, 0.2),
            ParameterRange.Whole("min_leaf_rows", 5, 100),
            ParameterRange.Whole("bins", 16, 255),
        ]),
        FamilyInput.Imputed,
        InDefaultSet: false)
    {
        Limits = ImmutableDictionary<string, ParameterLimit>.Empty
            // GAM bins per feature: at least 2 — ML.NET GamTrainerBase option checks (from memory).
            .Add("bins", new ParameterLimit(2, false, 65535, false, "bins per feature")),
    };

    /// <summary>
    /// ML.NET's SDCA ridge regression on fold-prepared inputs, budget = passes over the rows (SDCA's iterations);
    /// <c>l2</c> is the penalty of its objective (1/n)·Σ(ŷ−y)² + (l2/2)·‖w‖², i.e. scikit-learn's Ridge alpha = n·l2/2
    /// (LinearReferenceTests pins it).
    /// </summary>
    public static FamilyDescriptor Linear { get; } = new(
        FamilyNames.Linear,
        BudgetUnit.Passes,
        FirstRung: 6,
        FullBudget: 50,
        new ParameterSpace(
        [
            ParameterRange.Log("l2", 1e-4, 10),
        ]),
        FamilyInput.Scaled,
        InDefaultSet: false);

    /// <summary>Every family a definition may name, in the order searches list them.</summary>
    public static ImmutableArray<FamilyDescriptor> All { get; } = [LightGbm, FastTree, Forest, Gam, Linear];

    /// <summary>The families that read few-level category columns as level codes unless a definition says otherwise.</summary>
    public static ImmutableArray<string> LevelCodeFamilies { get; } = [.. All.Where(d => d.FewLevelForms[0] == CategoryEncodingKind.LevelCodes).Select(d => d.Name)];

    /// <summary>What a family's budget counts; boosting rounds for a name that is not built in.</summary>
    public static BudgetUnit UnitOf(string family) => Find(family)?.Unit ?? BudgetUnit.Rounds;

    /// <summary>The descriptor of a built-in family, or null for any other name.</summary>
    public static FamilyDescriptor? Find(string family) => All.FirstOrDefault(d => d.Name == family);

    /// <summary>The descriptor of a built-in family; an unknown name is an error that lists the built-in ones.</summary>
    public static FamilyDescriptor Get(string family) =>
        Find(family) ?? throw new ArgumentException($"unknown family '{family}'; built-in families are {string.Join(", ", All.Select(d => d.Name))}", nameof(family));
}
