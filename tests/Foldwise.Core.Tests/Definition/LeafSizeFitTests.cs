using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class LeafSizeFitTests
{
    private static readonly SearchDefinition Defaults = DefinitionDefaults.FromFlags("a.csv", "b.csv", "i", "y", trials: 4, hours: null, baseDirectory: "/w");

    [Fact]
    public void Folds_of_nine_training_rows_narrow_the_default_leaf_range_to_two_rows()
    {
        // When 12 rows in 4 folds leave 9 training rows in each fold
        var (fitted, changes) = LeafSizeFit.ToFolds(Defaults, smallestFoldTrainingRows: 9);

        // Then every family's min_leaf_rows is at most a quarter of 9, so a tree can split twice
        Assert.All(fitted.Families, f => Assert.Equal((2.0, 2.0), (f.Space.Find("min_leaf_rows")!.Low, f.Space.Find("min_leaf_rows")!.High)));
        Assert.Equal(Defaults.Families.Length, changes.Length);
        Assert.Contains("lightgbm min_leaf_rows 5–100 narrowed to 2–2: the smallest fold trains on 9 rows", changes);
    }

    [Fact]
    public void A_fold_of_two_hundred_rows_keeps_the_lower_bound_and_lowers_the_upper()
    {
        var (fitted, _) = LeafSizeFit.ToFolds(Defaults, smallestFoldTrainingRows: 200);

        var range = fitted.Families[0].Space.Find("min_leaf_rows")!;
        Assert.Equal((5.0, 50.0), (range.Low, range.High));
    }

    [Fact]
    public void Folds_large_enough_for_the_range_leave_the_definition_as_it_was()
    {
        var (fitted, changes) = LeafSizeFit.ToFolds(Defaults, smallestFoldTrainingRows: 2_400);

        Assert.Same(Defaults, fitted);
        Assert.Empty(changes);
    }

    [Fact]
    public void Other_parameters_keep_their_ranges_and_order()
    {
        var (fitted, _) = LeafSizeFit.ToFolds(Defaults, smallestFoldTrainingRows: 9);

        for (int f = 0; f < Defaults.Families.Length; f++)
        {
            var before = Defaults.Families[f].Space.Ranges;
            var after = fitted.Families[f].Space.Ranges;
            Assert.Equal(before.Select(r => r.Name), after.Select(r => r.Name));
            Assert.Equal(before.Where(r => r.Name != "min_leaf_rows"), after.Where(r => r.Name != "min_leaf_rows"));
        }
    }
}
