using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class DefinitionDefaultsTests
{
    [Fact]
    public void Flags_alone_give_both_families_the_default_schedule_and_40_trials()
    {
        // When a search is described by its data flags only
        var d = DefinitionDefaults.FromFlags("in/train.csv", "/abs/test.csv", "shipper_id", "q1_spend", trials: null, hours: null, baseDirectory: "/work/here");

        // Then it is a complete definition with the defaults
        Assert.Equal("search", d.Name);
        Assert.Equal(new DataSource("/work/here/in/train.csv", "/abs/test.csv", "shipper_id", "q1_spend"), d.Data);
        Assert.Equal(FamilyNames.Default, d.Families.Select(f => f.Family));
        Assert.True(d.Families.All(f => DefinitionComparer.SameSpace(DefaultSpaces.For(f.Family), f.Space)));
        Assert.Equal(ScheduleDefaults.Standard, d.Schedule);
        Assert.Equal(new SearchBudget(40, null), d.Budget);
        Assert.Equal((5, 1), (d.Folds, d.Seed));
    }

    [Fact]
    public void An_hours_flag_alone_gives_no_trial_limit()
    {
        var d = DefinitionDefaults.FromFlags("a", "b", "i", "y", trials: null, hours: 2, baseDirectory: "/w");

        Assert.Equal(new SearchBudget(null, 2), d.Budget);
    }

    [Fact]
    public void Flags_and_a_file_mean_the_same_search()
    {
        // Given the same search from flags and from a file that names only its data
        var fromFlags = DefinitionDefaults.FromFlags("a.csv", "b.csv", "i", "y", trials: 12, hours: null, seed: 9, folds: 4, baseDirectory: "/w");
        var fromFile = DefinitionReader.Parse(
            """{ "name": "search", "data": { "train": "a.csv", "test": "b.csv", "id": "i", "target": "y" }, "seed": 9, "folds": 4, "budget": { "trials": 12 } }""",
            "/w/search.json",
            "/w");

        // Then they are equal
        Assert.Equal(fromFile, fromFlags, DefinitionComparer.Instance);
    }

    [Fact]
    public void Budget_flags_given_with_a_file_replace_only_what_they_name()
    {
        // Given a file budget of 60 trials and 2 hours
        var d = DefinitionReader.Parse(DefinitionText.Full, "/defs/f.json", "/defs");

        // When flags give trials, hours, both or neither
        // Then each named part is replaced and the rest stays
        Assert.Equal(new SearchBudget(10, 2), DefinitionDefaults.Override(d, 10, null).Budget);
        Assert.Equal(new SearchBudget(60, 0.5), DefinitionDefaults.Override(d, null, 0.5).Budget);
        Assert.Equal(new SearchBudget(5, 8), DefinitionDefaults.Override(d, 5, 8).Budget);
        Assert.Same(d, DefinitionDefaults.Override(d, null, null));
        Assert.Equal(d with { Budget = d.Budget }, DefinitionDefaults.Override(d, 10, null) with { Budget = d.Budget }, DefinitionComparer.Instance);
    }

    [Theory]
    [InlineData(0, null, "--trials must be at least 1, got 0")]
    [InlineData(null, 0.0, "--hours must be above 0, got 0")]
    [InlineData(null, -1.5, "--hours must be above 0, got -1.5")]
    public void Bad_budget_flags_are_input_errors_naming_the_flag(int? trials, double? hours, string problem)
    {
        var fromFlags = Assert.Throws<InputException>(() => DefinitionDefaults.FromFlags("a", "b", "i", "y", trials, hours, baseDirectory: "/w"));
        var overriding = Assert.Throws<InputException>(() =>
            DefinitionDefaults.Override(DefinitionDefaults.FromFlags("a", "b", "i", "y", null, null, baseDirectory: "/w"), trials, hours));

        Assert.Equal($"command line: {problem}", fromFlags.Message);
        Assert.Equal(problem, overriding.Problem);
    }

    [Fact]
    public void Bad_data_flags_are_input_errors_naming_the_flag()
    {
        Assert.Equal("--target needs a value", Assert.Throws<InputException>(() => DefinitionDefaults.FromFlags("a", "b", "i", " ", null, null)).Problem);
        Assert.Equal("--target must differ from --id, both are \"i\"", Assert.Throws<InputException>(() => DefinitionDefaults.FromFlags("a", "b", "i", "i", null, null)).Problem);
        Assert.Equal("--folds must be at least 2, got 1", Assert.Throws<InputException>(() => DefinitionDefaults.FromFlags("a", "b", "i", "y", null, null, folds: 1)).Problem);
    }

    [Fact]
    public void Relative_flag_paths_default_to_the_current_folder()
    {
        var d = DefinitionDefaults.FromFlags("a.csv", "b.csv", "i", "y", null, null);

        Assert.Equal(Path.Combine(Directory.GetCurrentDirectory(), "a.csv"), d.Data.Train);
    }
}
