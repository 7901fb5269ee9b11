using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Encodings;

public sealed class FoldEncoderTests
{
    // Every level counts from one row, and three kept slots exceed this cap, so the column is target-mean encoded.
    private static readonly EncodingOptions TargetMean = new(MinLevelCount: 1, IndicatorCap: 1, MinSamples: 2, Steepness: 1, InnerFolds: 3);

    [Fact]
    public void Smoothed_mean_matches_a_hand_worked_example_of_Micci_Barreca_formula()
    {
        // Given a level of 4 rows with mean 3, a prior of 2, k = 2 and f = 1
        // Hand-worked from Micci-Barreca, SIGKDD Explorations 3(1), 2001: λ = 1 / (1 + e^-(4-2)/1) = 0.880797077977882…,
        // encoding = λ·3 + (1 − λ)·2 = 2 + λ = 2.880797077977882
        double encoded = SmoothedMean.Of(levelSum: 12, levelCount: 4, prior: 2, minSamples: 2, steepness: 1);

        Assert.Equal(2.880797077977882, encoded, 1e-12);
    }

    [Fact]
    public void Smoothed_mean_of_a_level_without_rows_is_the_prior()
    {
        Assert.Equal(2.5, SmoothedMean.Of(0, 0, 2.5, 10, 4));
    }

    [Fact]
    public void Changing_the_targets_of_validation_rows_changes_no_encoding_fitted_for_the_fold()
    {
        // Given a target-mean encoded column and fold 0's training rows
        var (data, trainRows, validation) = Scenario(TargetMean);
        var before = FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean);

        // When every validation row's target changes
        var target = (double[])data.Target.Clone();
        foreach (int row in validation)
        {
            target[row] += 100;
        }

        var after = FoldEncoder.Prepare(data with { Target = target }, trainRows, seed: 7, TargetMean);

        // Then every encoded cell, of training, validation and test rows alike, is unchanged
        AssertSameCells(before.Train, after.Train);
        AssertSameCells(before.Test, after.Test);
        Assert.NotEqual(before.Train.Values, FoldEncoder.Prepare(data with { Target = Shifted(data.Target, trainRows[0]) }, trainRows, 7, TargetMean).Train.Values);
    }

    [Fact]
    public void A_training_row_own_target_never_enters_its_encoding()
    {
        var (data, trainRows, _) = Scenario(TargetMean);
        int row = trainRows[0];
        var before = FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean);

        var after = FoldEncoder.Prepare(data with { Target = Shifted(data.Target, row) }, trainRows, seed: 7, TargetMean);

        Assert.Equal(before.Train.RowValues(row).ToArray(), after.Train.RowValues(row).ToArray());
    }

    [Fact]
    public void Encodes_validation_and_test_rows_with_the_smoothed_mean_of_all_the_fold_training_rows()
    {
        var (data, trainRows, validation) = Scenario(TargetMean);

        var inputs = FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean);

        // The level "a" over fold 0's training rows, by hand from the same formula
        var aRows = trainRows.Where(r => data.Categories[0].Train[r] == 0).ToArray();
        double prior = trainRows.Average(r => data.Target[r]);
        double expected = SmoothedMean.Of(aRows.Sum(r => data.Target[r]), aRows.Length, prior, 2, 1);
        int aValidation = validation.First(r => data.Categories[0].Train[r] == 0);
        Assert.Equal((float)expected, inputs.Train.RowValues(aValidation)[^1]);
        Assert.Equal((float)expected, inputs.Test.RowValues(0)[^1]);
    }

    [Fact]
    public void Gives_every_trial_of_a_fold_the_same_inputs_marked_with_their_fold()
    {
        // Given a target-mean encoded column, whose training rows' means come from seeded inner folds
        var (data, _, _) = Scenario(TargetMean);

        // When fold 0's inputs are asked for twice, as two trials of the fold do
        var one = data.InputsFor(fold: 0, CategoryEncodingKind.Indicators);
        var other = data.InputsFor(fold: 0, CategoryEncodingKind.Indicators);

        // Then both hold the same cells, and say which fold of the plan they were encoded for
        AssertSameCells(one.Train, other.Train);
        AssertSameCells(one.Test, other.Test);
        Assert.Equal(0, one.PlanFold);
    }

    [Fact]
    public void The_test_rows_cells_do_not_depend_on_the_seed()
    {
        // Given a target-mean encoded column and fold 0's training rows
        var (data, trainRows, _) = Scenario(TargetMean);

        // When the fold is encoded with two seeds
        var one = FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean);
        var other = FoldEncoder.Prepare(data, trainRows, seed: 8, TargetMean);

        // Then the seed moved the training rows' inner-fold means but no test cell (those come from all the fold's training rows)
        Assert.NotEqual(one.Train.Values, other.Train.Values);
        AssertSameCells(one.Test, other.Test);
    }

    [Fact]
    public void Gives_kept_levels_missing_and_other_an_indicator_each_and_sends_rare_and_unseen_levels_to_other()
    {
        // Given levels a (3 rows), b (3 rows), rare c (1 row) and gaps, with a minimum count of 2
        var options = new EncodingOptions(MinLevelCount: 2);
        var train = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 2, 3, 4, 5, 6, 7, 8])], [1, 2, 3, 4, 5, 6, 7, 8]), "c", "a", "b", "a", "b", null, "a", "b", "c");
        var test = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 2, 3])]), "c", "b", "new", null);
        var data = Data(train, test, options, new FoldPlan(1, 0, [.. Enumerable.Repeat(0, 8)]));

        var inputs = FoldEncoder.Prepare(data, [.. Enumerable.Range(0, 8)], seed: 1, options);

        // Then the slots are a=1, b=2, missing=3, other=4 after the one numeric column
        Assert.Equal(5, inputs.ColumnCount);
        Assert.Equal([0, 1], inputs.Train.RowColumns(0).ToArray());
        Assert.Equal([0, 4], inputs.Train.RowColumns(7).ToArray());
        Assert.Equal([0, 3], inputs.Train.RowColumns(4).ToArray());
        Assert.Equal([[0, 2], [0, 4], [0, 3]], Enumerable.Range(0, 3).Select(r => inputs.Test.RowColumns(r).ToArray()));
    }

    [Fact]
    public void Gives_a_few_level_column_one_column_of_slot_codes_for_a_family_that_splits_on_categories()
    {
        // Given levels a (3 rows), b (3 rows), rare c (1 row) and gaps, with a minimum count of 2
        var options = new EncodingOptions(MinLevelCount: 2);
        var train = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 2, 3, 4, 5, 6, 7, 8])], [1, 2, 3, 4, 5, 6, 7, 8]), "c", "a", "b", "a", "b", null, "a", "b", "c");
        var test = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 2, 3])]), "c", "b", "new", null);
        var data = Data(train, test, options, new FoldPlan(1, 0, [.. Enumerable.Repeat(0, 8)]));

        // When the fold is encoded as level codes
        var inputs = FoldEncoder.Prepare(data, [.. Enumerable.Range(0, 8)], seed: 1, options, CategoryEncodingKind.LevelCodes);

        // Then one column after the numeric one holds the slot: a=0 (no cell), b=1, missing=2, other=3 (rare c, unseen "new")
        Assert.Equal(2, inputs.ColumnCount);
        Assert.Equal([1], inputs.LevelCodeColumns.ToArray());
        float Code(SparseRowMatrix m, int row) => m.RowColumns(row).IndexOf(1) is int at and >= 0 ? m.RowValues(row)[at] : 0f;
        Assert.Equal([0f, 1f, 0f, 1f, 2f, 0f, 1f, 3f], Enumerable.Range(0, 8).Select(r => Code(inputs.Train, r)));
        Assert.Equal([1f, 3f, 2f], Enumerable.Range(0, 3).Select(r => Code(inputs.Test, r)));
    }

    [Fact]
    public void Keeps_target_mean_columns_as_they_are_when_few_level_columns_become_level_codes()
    {
        var (data, trainRows, _) = Scenario(TargetMean);

        var codes = FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean, CategoryEncodingKind.LevelCodes);

        AssertSameCells(FoldEncoder.Prepare(data, trainRows, seed: 7, TargetMean).Train, codes.Train);
        Assert.Empty(codes.LevelCodeColumns);
    }

    [Fact]
    public void Returns_the_table_own_rows_when_there_are_no_category_columns()
    {
        var table = TinyTables.FromColumns([("x", [1, 2, 3, 4])], [1, 2, 3, 4]);
        var data = TrialData.From(table, table, new FoldPlan(2, 0, [0, 1, 0, 1]), Metric.Rmse);

        var inputs = data.InputsFor(fold: 1, FamilyNames.LightGbm);

        Assert.Same(data.Train, inputs.Train);
        Assert.Same(data.Test, inputs.Test);
    }

    [Fact]
    public void Imputes_the_fold_training_median_and_adds_a_was_missing_column()
    {
        // Given a column 0, 4, NaN, 2, 8 whose fold training rows are 0, 1, 2, 3 (median of 0, 2, 4 is 2)
        var table = TinyTables.FromColumns([("x", [0, 4, float.NaN, 2, 8]), ("z", [1, 1, 1, 1, float.NaN])], [1, 2, 3, 4, 5]);
        var data = TrialData.From(table, table, new FoldPlan(2, 0, [0, 0, 0, 0, 1]), Metric.Rmse);

        var imputed = data.InputsFor(fold: 1, FamilyNames.FastTree).Imputed([0, 1, 2, 3]);

        // Then the gap takes 2 and a third column flags it; z, missing only outside the training rows, gets its median 1 and no flag
        Assert.Equal(3, imputed.ColumnCount);
        Assert.Equal([0, 1, 2], imputed.Train.RowColumns(2).ToArray());
        Assert.Equal([2f, 1f, 1f], imputed.Train.RowValues(2).ToArray());
        Assert.Equal([0, 1], imputed.Train.RowColumns(4).ToArray());
        Assert.Equal([8f, 1f], imputed.Train.RowValues(4).ToArray());
        Assert.False(imputed.HasMissing);
    }

    private static (TrialData Data, ImmutableArray<int> TrainRows, ImmutableArray<int> Validation) Scenario(EncodingOptions options)
    {
        string[] levels = ["a", "b", "a", "c", "b", "a", "a", "c", "b", "a", "b", "c"];
        double[] target = [3, 1, 4, 1, 5, 9, 2, 6, 5, 3, 5, 8];
        var train = TinyTables.WithCategory(TinyTables.FromColumns([("x", [.. Enumerable.Range(1, 12).Select(i => (float)i)])], target), "c", levels);
        var test = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 2])]), "c", "a", "zzz");
        var plan = new FoldPlan(3, 0, [0, 1, 2, 0, 1, 2, 0, 1, 2, 0, 1, 2]);
        var data = Data(train, test, options, plan);
        return (data, plan.TrainRows(0), plan.ValidationRows(0));
    }

    private static TrialData Data(FeatureTable train, FeatureTable test, EncodingOptions options, FoldPlan plan) =>
        TrialData.From(train, test, plan, Metric.Rmse) with { Categories = TrialCategories.From(train, test, options) };

    private static double[] Shifted(double[] target, int row)
    {
        var shifted = (double[])target.Clone();
        shifted[row] += 100;
        return shifted;
    }

    private static void AssertSameCells(SparseRowMatrix expected, SparseRowMatrix actual)
    {
        Assert.Equal(expected.RowStarts, actual.RowStarts);
        Assert.Equal(expected.ColumnIndices, actual.ColumnIndices);
        Assert.Equal(expected.Values, actual.Values);
    }
}
