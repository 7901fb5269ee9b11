using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Spaces;

public sealed class FamilyDescriptorsTests
{
    [Fact]
    public void Every_family_has_its_own_budget_unit_and_a_first_rung_below_its_full_budget()
    {
        foreach (var d in FamilyDescriptors.All)
        {
            Assert.InRange(d.FirstRung, 1, d.FullBudget - 1);
            Assert.False(d.Space.Ranges.IsEmpty, $"{d.Name} has no parameters");
        }

        Assert.Equal(BudgetUnit.Rounds, FamilyDescriptors.LightGbm.Unit);
        Assert.Equal(BudgetUnit.Trees, FamilyDescriptors.Forest.Unit);
        Assert.Equal(BudgetUnit.Iterations, FamilyDescriptors.Gam.Unit);
        Assert.Equal(BudgetUnit.Passes, FamilyDescriptors.Linear.Unit);
    }

    [Fact]
    public void The_default_set_and_the_names_follow_the_descriptors()
    {
        Assert.Equal(FamilyDescriptors.All.Select(d => d.Name), FamilyNames.All);
        Assert.Equal(FamilyDescriptors.All.Where(d => d.InDefaultSet).Select(d => d.Name), FamilyNames.Default);
        Assert.Equal(FamilyNames.Default, DefinitionDefaults.DefaultFamilies.Select(f => f.Family));
    }

    [Fact]
    public void Only_LightGbm_reads_missing_cells_as_they_are()
    {
        Assert.Equal([FamilyNames.LightGbm], FamilyDescriptors.All.Where(d => d.Input == FamilyInput.RawWithMissing).Select(d => d.Name));
        Assert.Equal(FamilyInput.Scaled, FamilyDescriptors.Linear.Input);
    }

    [Fact]
    public void A_limit_only_one_family_has_is_checked_for_that_family()
    {
        // Given a GAM with one bin per feature (its descriptor asks for at least 2)
        var gam = ParameterSet.Of(new Dictionary<string, double> { ["learning_rate"] = 0.05, ["min_leaf_rows"] = 20, ["bins"] = 1 });

        // Then a worker refuses it, naming the limit
        Assert.Contains(ParameterChecks.Problems(FamilyNames.Gam, gam), p => p.Contains("'bins' = 1 must be at least 2", StringComparison.Ordinal));

        // And a definition asking for it is refused at its line and column
        var json = """{ "data": { "train": "a.csv", "test": "b.csv", "id": "i", "target": "y" }, "families": { "gam": { "bins": { "whole": [1, 64] } } } }""";
        var error = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "s.json", "/w"));
        Assert.Contains("must be at least 2 (bins per feature)", error.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_family_is_refused_with_the_built_in_names()
    {
        var error = Assert.Throws<ArgumentException>(() => FamilyDescriptors.Get("knn"));

        Assert.Contains("lightgbm, fasttree, forest, gam, linear", error.Message, StringComparison.Ordinal);
    }
}
