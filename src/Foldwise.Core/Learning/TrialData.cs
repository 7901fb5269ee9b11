using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// What every trial of a search reads: the screened training and test features row by row (missing cells NaN),
/// the target already on the fitting scale, the fold plan, the metric, and the category columns that each fold
/// encodes on its own training rows. Built once per worker and search.
/// </summary>
public sealed record TrialData(
    SparseRowMatrix Train,
    double[] Target,
    SparseRowMatrix Test,
    FoldPlan Folds,
    Metric Metric,
    ImmutableArray<TrialCategory> Categories = default)
{
    public static TrialData From(FeatureTable train, FeatureTable test, FoldPlan folds, Metric metric) =>
        new(train.ToRows(), [.. train.Target.Select(metric.Forward)], test.ToRows(), folds, metric, TrialCategories.From(train, test, EncodingOptions.Default));

    /// <summary>
    /// Families that read each few-level category column as one column of level codes and split on it themselves
    /// (<see cref="CategoryEncodingKind.LevelCodes"/>); every other family reads indicator columns. By default the
    /// families whose descriptor reads level codes first (<see cref="FamilyDescriptor.FewLevelForms"/>); a search's
    /// definition may choose otherwise.
    /// </summary>
    public ImmutableArray<string> LevelCodeFamilies { get; init; } = FamilyDescriptors.LevelCodeFamilies;

    /// <summary>One fold's inputs for <paramref name="family"/>, encoded from that fold's training rows only.</summary>
    public FoldInputs InputsFor(int fold, string family) => InputsFor(fold, FewLevelsFor(family));

    /// <summary>
    /// One fold's inputs with few-level category columns in the form <paramref name="fewLevels"/>, encoded from that
    /// fold's training rows only. They depend on the fold and the form alone, never on a trial (the inner folds of
    /// target means draw from <see cref="SearchSeeds.Encoding"/>), so every trial of the fold reads the same inputs
    /// and a learner may reuse what it prepared from them (LightGBM's binned rows).
    /// </summary>
    public FoldInputs InputsFor(int fold, CategoryEncodingKind fewLevels) =>
        FoldEncoder.Prepare(this, Folds.TrainRows(fold), SearchSeeds.Encoding(Folds.Seed, fold), EncodingOptions.Default, fewLevels).OfPlanFold(fold);

    /// <summary>What a few-level category column becomes for <paramref name="family"/>.</summary>
    public CategoryEncodingKind FewLevelsFor(string family) =>
        LevelCodeFamilies.Contains(family) ? CategoryEncodingKind.LevelCodes : CategoryEncodingKind.Indicators;
}
