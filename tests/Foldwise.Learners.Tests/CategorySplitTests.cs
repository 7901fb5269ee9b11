using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

namespace Foldwise.Learners.Tests;

/// <summary>LightGBM reads a few-level category column as one column of level codes and groups levels inside its own splits.</summary>
public sealed class CategorySplitTests
{
    private const int Rows = 300;

    /// <summary>Six levels (more than LightGBM's one-vs-rest limit of 4) whose targets alternate 0, 10, 0, 10, 0, 10 in code order.</summary>
    private static TrialData Alternating()
    {
        string[] levels = ["a", "b", "c", "d", "e", "f"];
        var numeric = Foldwise.Testing.TinyTables.FromRows(
            [.. Enumerable.Range(0, Rows).Select(_ => new float[1])],
            [.. Enumerable.Range(0, Rows).Select(r => r % 6 % 2 == 0 ? 0.0 : 10.0)]);
        var table = Foldwise.Testing.TinyTables.WithCategory(numeric, "kind", [.. Enumerable.Range(0, Rows).Select(r => levels[r % 6])]);
        return TrialData.From(table, table, new FoldPlan(2, 0, [.. Enumerable.Range(0, Rows).Select(r => r / 6 % 2)]), Metric.Rmse);
    }

    private static FoldJob OneSplit(TrialData data)
    {
        var parameters = ParameterSet.Of(new Dictionary<string, double>
        {
            ["learning_rate"] = 1, ["leaves"] = 2, ["min_leaf_rows"] = 5, ["feature_fraction"] = 1, ["row_fraction"] = 1, ["l2"] = 0,
        });
        return TinyTables.Job(data, FamilyNames.LightGbm, parameters, budget: 1) with { Inputs = data.InputsFor(fold: 0, FamilyNames.LightGbm) };
    }

    [Fact]
    public void Groups_levels_that_are_not_neighbours_in_code_order_within_one_split()
    {
        // Given the alternating levels read as level codes
        var data = Alternating() with { LevelCodeFamilies = [FamilyNames.LightGbm] };

        // When one round of one split is fitted
        var prediction = new LightGbmLearner().Fit(OneSplit(data), CancellationToken.None);

        // Then every level is predicted at its own target: the split sent b, d and f one way and a, c and e the other,
        // which no threshold on the codes and no single indicator column can do
        for (int r = 0; r < 6; r++)
        {
            Assert.InRange(prediction.Test[r], data.Target[r] - 0.5, data.Target[r] + 0.5);
        }
    }

    [Fact]
    public void With_indicator_columns_one_split_separates_one_level_only()
    {
        // Given the same table read as indicator columns
        var data = Alternating() with { LevelCodeFamilies = [] };

        // When one round of one split is fitted
        var prediction = new LightGbmLearner().Fit(OneSplit(data), CancellationToken.None);

        // Then some level is predicted far from its target
        Assert.Contains(Enumerable.Range(0, 6), r => Math.Abs(prediction.Test[r] - data.Target[r]) > 2);
    }

    [Fact]
    public void Declares_the_level_code_columns_categorical_with_the_candidates_leaf_size_and_l2()
    {
        // Given a job whose inputs hold one level-code column after the one numeric column
        var data = Alternating() with { LevelCodeFamilies = [FamilyNames.LightGbm] };
        var job = OneSplit(data);

        // When its LightGBM parameters are written
        string parameters = LightGbmParameters.For(job);

        // Then column 1 is categorical, a group of levels needs a leaf's rows, and the category split's L2 is the leaves'
        Assert.Equal([1], job.Features.LevelCodeColumns.ToArray());
        Assert.Contains("categorical_feature=1 ", parameters, StringComparison.Ordinal);
        Assert.Contains("min_data_per_group=5 ", parameters, StringComparison.Ordinal);
        Assert.Contains("cat_l2=0 ", parameters, StringComparison.Ordinal);
        Assert.DoesNotContain("categorical_feature", LightGbmParameters.For(OneSplit(Alternating() with { LevelCodeFamilies = [] })), StringComparison.Ordinal);
    }
}
