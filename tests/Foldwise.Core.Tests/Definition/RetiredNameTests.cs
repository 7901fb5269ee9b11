using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

/// <summary>
/// Names an earlier version of the syntax used: a file a person writes is refused with the new name suggested (edit
/// distance would not find it); the definition a store kept from that version still reads, each old name as its new one.
/// </summary>
public sealed class RetiredNameTests
{
    /// <summary>One case per family of retired spellings: an edit of <see cref="DefinitionText.Full"/>, the message, where it points.</summary>
    public static TheoryData<string, string, string, string> Retired => new()
    {
        // the budget range of schedule
        { "\"first_rung\": 25", "\"min_rounds\": 25", "unknown key 'schedule.min_rounds' (a retired name); did you mean 'first_rung'?", "\"min_rounds\"" },

        // the range words
        { "{ \"whole\": [8, 128] }", "{ \"int\": [8, 128] }", "unknown key 'families.lightgbm.leaves.int' (a retired name); did you mean 'whole'?", "\"int\"" },

        // the blend mode word the command line used to spell its own way
        { "\"mode\": \"simplex\"", "\"mode\": \"nonneg\"", "'blend.mode' cannot be \"nonneg\" (a retired name); did you mean \"non_negative\"?", "\"nonneg\"" },
    };

    [Theory]
    [MemberData(nameof(Retired))]
    public void Refuses_a_retired_name_in_a_file_and_suggests_the_new_one(string replace, string with, string message, string pointedAt)
    {
        // Given a definition a person wrote with a retired name
        string json = DefinitionText.Full.Replace(replace, with, StringComparison.Ordinal);

        // When it is read as a file
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(json, "/defs/old.json", DefinitionText.Folder));

        // Then it is refused at that name, with the new name suggested
        Assert.Contains(message, e.Problem);
        Assert.Equal(DefinitionText.PositionOf(json, pointedAt), (e.Line!.Value, e.Column!.Value));
    }

    [Fact]
    public void Reads_a_definition_a_store_kept_before_the_renames()
    {
        // Given definition text as an earlier version's writer stored it
        string stored = """
            {
              "name": "freight-old",
              "data": { "train": "/d/train.csv", "test": "/d/test.csv", "id": "shipper_id", "target": "q1_spend" },
              "metric": "rmsle",
              "folds": 5,
              "seed": 7,
              "screening": { "min_nonzero": 3 },
              "families": {
                "lightgbm": { "learning_rate": {"log": [0.01, 0.3]}, "leaves": {"int": [8, 128]}, "min_leaf_rows": {"int": [5, 100]},
                              "feature_fraction": {"float": [0.1, 1]}, "row_fraction": 0.8, "l2": {"log": [0.001, 10]} }
              },
              "schedule": { "kind": "asha", "proposer": "tpe", "min_rounds": 20, "max_rounds": 180, "eta": 3, "rate_scaling": 0.5, "brackets": 1 },
              "budget": { "trials": 60 },
              "blend": { "mode": "non_negative", "pool": 3 }
            }
            """;

        // When the store's copy is read
        var definition = DefinitionReader.ParseStored(stored, "/runs/old/search.db", "/runs/old");

        // Then every old name means its new one
        Assert.Equal((20, 180), (definition.Schedule.FirstRung, definition.Schedule.FullBudget));
        var space = definition.Families.Single().Space;
        Assert.Equal(ParameterRange.Whole("leaves", 8, 128), space.Find("leaves"));
        Assert.Equal(ParameterRange.Linear("feature_fraction", 0.1, 1), space.Find("feature_fraction"));
        Assert.Equal(BlendMode.NonNegative, definition.Blend.Mode);

        // And written again it uses only the new names
        string rewritten = DefinitionWriter.Write(definition);
        Assert.Contains("\"first_rung\": 20", rewritten);
        Assert.DoesNotContain("\"int\"", rewritten);
        Assert.DoesNotContain("min_rounds", rewritten);
    }

    [Fact]
    public void Reads_a_stored_one_of_range_under_its_retired_word()
    {
        // Given a stored family space whose named parameter was written with the old word
        var toy = new FamilySearch("toy", new ParameterSpace([ParameterRange.OneOf("growth", "leafwise", "symmetric")]));
        string stored = """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" }, "families": { "toy": { "growth": { "choice": ["symmetric"] } } } }""";

        // When it is read as a store's copy, and as a person's file
        var definition = DefinitionReader.Parse(System.Text.Encoding.UTF8.GetBytes(stored), "s.db", "/d", [toy], acceptRetired: true);
        var refused = Assert.Throws<InputException>(() => DefinitionReader.Parse(System.Text.Encoding.UTF8.GetBytes(stored), "s.json", "/d", [toy]));

        // Then the store's copy keeps the range and the file is told the new word
        Assert.Equal("symmetric", Assert.Single(definition.Families.Single().Space.Find("growth")!.Choices));
        Assert.Contains("did you mean 'one_of'?", refused.Problem);
    }
}
