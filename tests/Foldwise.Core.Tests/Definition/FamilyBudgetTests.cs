using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class FamilyBudgetTests
{
    private const string Data = """ "data": { "train": "a.csv", "test": "b.csv", "id": "i", "target": "y" } """;

    private static SearchDefinition Read(string rest) => DefinitionReader.Parse($$"""{ {{Data}}, {{rest}} }""", "s.json", "/w");

    [Fact]
    public void Without_rungs_anywhere_each_family_takes_its_descriptors_in_its_own_unit()
    {
        // Given families named without rungs and a schedule without rungs
        var d = Read(""" "families": { "lightgbm": {}, "forest": {}, "linear": {} }, "schedule": { "eta": 3 } """);

        // Then each runs its descriptor's rungs
        Assert.Equal(new FamilyBudget(25, 400), d.BudgetOf(FamilyNames.LightGbm));
        Assert.Equal(new FamilyBudget(FamilyDescriptors.Forest.FirstRung, FamilyDescriptors.Forest.FullBudget), d.BudgetOf(FamilyNames.Forest));
        Assert.Equal(new FamilyBudget(FamilyDescriptors.Linear.FirstRung, FamilyDescriptors.Linear.FullBudget), d.BudgetOf(FamilyNames.Linear));
    }

    [Fact]
    public void A_familys_own_rungs_win_and_the_schedules_written_rungs_speak_for_the_others()
    {
        // Given a definition written before families had rungs (schedule rungs) plus one family with its own
        var d = Read(""" "families": { "lightgbm": {}, "forest": { "first_rung": 10, "full_budget": 90 }, "gam": { "full_budget": 500 } }, "schedule": { "first_rung": 20, "full_budget": 180 } """);

        // Then the schedule's rungs keep their old meaning for the family without its own
        Assert.Equal(new FamilyBudget(20, 180), d.BudgetOf(FamilyNames.LightGbm));
        Assert.Equal(new FamilyBudget(10, 90), d.BudgetOf(FamilyNames.Forest));
        Assert.Equal(new FamilyBudget(20, 500), d.BudgetOf(FamilyNames.Gam));
    }

    [Fact]
    public void A_search_without_families_gives_the_default_families_their_descriptors_rungs()
    {
        var d = Read(""" "budget": { "trials": 5 } """);

        Assert.All(d.Families, f => Assert.Equal(new FamilyBudget(FamilyDescriptors.Get(f.Family).FirstRung, FamilyDescriptors.Get(f.Family).FullBudget), f.Budget));
    }

    [Fact]
    public void A_full_budget_below_the_first_rung_is_refused_at_its_place()
    {
        string text = $$"""{ {{Data}}, "families": { "forest": { "first_rung": 50, "full_budget": 40 } } }""";

        var error = Assert.Throws<InputException>(() => DefinitionReader.Parse(text, "s.json", "/w"));

        Assert.Contains("'families.forest.full_budget' (40) is below its first_rung (50) trees", error.Message, StringComparison.Ordinal);
        Assert.Equal(DefinitionText.PositionOf(text, "40 }"), (error.Line!.Value, error.Column!.Value));
    }

    [Fact]
    public void Written_rungs_read_back_the_same_and_a_search_built_in_code_keeps_the_schedules()
    {
        // Given a definition with rungs per family, written and read back
        var d = Read(""" "families": { "lightgbm": {}, "linear": { "first_rung": 3, "full_budget": 27 } } """);
        var again = DefinitionReader.Parse(DefinitionWriter.Write(d), "s.json", "/w");

        // Then nothing changed
        Assert.Equal(d, again, DefinitionComparer.Instance);
        Assert.Equal(new FamilyBudget(3, 27), again.BudgetOf(FamilyNames.Linear));

        // And a family built without rungs takes the schedule's
        var built = d with { Families = [new FamilySearch(FamilyNames.Linear, DefaultSpaces.Linear)] };
        Assert.Equal(new FamilyBudget(d.Schedule.FirstRung, d.Schedule.FullBudget), built.BudgetOf(FamilyNames.Linear));
    }
}
