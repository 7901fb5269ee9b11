using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class DefinitionWriterTests
{
    [Fact]
    public void The_demo_config_survives_a_write_and_a_read()
    {
        // Given the demo definition as read from the repository
        var demo = DefinitionReader.Read(DefinitionText.RepositoryFile("configs/demo.json"));

        // When it is written and the text parsed back, from another folder
        string text = DefinitionWriter.Write(demo);
        var back = DefinitionReader.Parse(text, "/elsewhere/stored.json", "/elsewhere");

        // Then it is the same definition, with the same absolute paths, and writes the same text
        Assert.Equal(demo, back, DefinitionComparer.Instance);
        Assert.Equal(demo.Data, back.Data);
        Assert.Equal(text, DefinitionWriter.Write(back));
    }

    [Fact]
    public void A_definition_unlike_every_default_survives_a_write_and_a_read()
    {
        // Given a definition that differs from the defaults everywhere, with every kind of range
        var lightgbm = new ParameterSpace(
        [
            ParameterRange.Fixed("learning_rate", 0.05),
            ParameterRange.Whole("leaves", 31, 31),
            ParameterRange.Whole("min_leaf_rows", 2, 400),
            ParameterRange.Log("feature_fraction", 0.012345678901234567, 1),
            ParameterRange.Linear("row_fraction", 1.0 / 3, 0.9),
            ParameterRange.Log("l2", 1e-7, 1e-7),
        ]);
        var d = new SearchDefinition
        {
            Name = "q1 spend — wide run",
            Data = new DataSource("/data/tables/trän.csv", "/data/tables/test \"v2\".csv", "row id", "spend"),
            Metric = MetricKind.Mae,
            Folds = 10,
            Seed = -3,
            Screening = new ScreeningOptions(7),
            Families = [new FamilySearch(FamilyNames.FastTree, DefaultSpaces.FastTree), new FamilySearch(FamilyNames.LightGbm, lightgbm)],
            Schedule = new ScheduleOptions(ScheduleKind.Hyperband, ProposerKind.Random, 1, 81, 3),
            Budget = new SearchBudget(null, 0.25),
            Blend = new BlendOptions(BlendMode.NonNegative, 1),
        };

        // When it is written and read back
        var back = DefinitionReader.Parse(DefinitionWriter.Write(d), "/x/y.json", "/x");

        // Then nothing changed: not a digit of a double, not a range kind, not the family order
        Assert.Equal(d, back, DefinitionComparer.Instance);
        Assert.Equal<ParameterRange>(lightgbm.Ranges, back.Families[1].Space.Ranges);
    }

    [Fact]
    public void Writes_every_key_so_the_stored_text_stands_alone()
    {
        // Given a definition from flags
        var d = DefinitionDefaults.FromFlags("a.csv", "b.csv", "id", "y", trials: null, hours: 1.5, baseDirectory: "/w");

        // When it is written
        string text = DefinitionWriter.Write(d);

        // Then every section and every parameter is spelled out, ranges one per line
        foreach (string key in new[] { "\"name\"", "\"data\"", "\"metric\"", "\"folds\"", "\"seed\"", "\"screening\"", "\"families\"", "\"schedule\"", "\"budget\"", "\"blend\"" })
        {
            Assert.Contains(key, text);
        }

        Assert.Contains("\"train\": \"/w/a.csv\"", text);
        Assert.Contains("\"l2\": {\"log\": [0.001, 10]}", text);
        Assert.Contains("\"hours\": 1.5", text);
        Assert.DoesNotContain("\"trials\"", text);
    }

    [Fact]
    public void Choice_parameters_are_read_and_written_by_name()
    {
        // Given a family whose space has a one_of parameter (no built-in family has one yet)
        var standard = new ParameterSpace([ParameterRange.OneOf("growth", "leafwise", "depthwise", "symmetric"), ParameterRange.Whole("leaves", 8, 64)]);
        IReadOnlyList<FamilySearch> builtIn = [new("toy", standard)];
        string json = """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" }, "families": { "toy": { "growth": { "one_of": ["symmetric", "leafwise"] } } } }""";

        // When it is read, written and read again
        var d = DefinitionReader.Parse(System.Text.Encoding.UTF8.GetBytes(json), "t.json", "/t", builtIn);
        string text = DefinitionWriter.Write(d);
        var back = DefinitionReader.Parse(System.Text.Encoding.UTF8.GetBytes(text), "t.json", "/t", builtIn);

        // Then the one_of range keeps the file's names in the file's order, and survives the trip
        var growth = d.Families.Single().Space.Find("growth")!;
        Assert.Equal<string>(["symmetric", "leafwise"], growth.Choices);
        Assert.Equal((0.0, 1.0), (growth.Low, growth.High));
        Assert.Contains("\"growth\": {\"one_of\": [\"symmetric\", \"leafwise\"]}", text);
        Assert.Equal(d, back, DefinitionComparer.Instance);
    }

    [Fact]
    public void A_name_outside_the_familys_one_of_list_is_refused_with_the_valid_ones()
    {
        // Given a misspelt name
        IReadOnlyList<FamilySearch> builtIn = [new("toy", new ParameterSpace([ParameterRange.OneOf("growth", "leafwise", "depthwise")]))];
        string json = """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" }, "families": { "toy": { "growth": { "one_of": ["leafwise", "depthwsie"] } } } }""";

        // When it is read
        var e = Assert.Throws<InputException>(() => DefinitionReader.Parse(System.Text.Encoding.UTF8.GetBytes(json), "t.json", "/t", builtIn));

        // Then the message names the item, suggests the near name and points at it
        Assert.Equal("'families.toy.growth.one_of[1]' cannot be \"depthwsie\"; did you mean \"depthwise\"? (valid: leafwise, depthwise)", e.Problem);
        Assert.Equal(DefinitionText.PositionOf(json, "\"depthwsie\""), (e.Line!.Value, e.Column!.Value));
    }

    [Fact]
    public void The_comparer_sees_a_changed_range()
    {
        // Given two reads of one file, and a third with one bound moved
        var a = DefinitionReader.Parse(DefinitionText.Full, "/defs/f.json", "/defs");
        var b = DefinitionReader.Parse(DefinitionText.Full, "/defs/f.json", "/defs");
        var c = DefinitionReader.Parse(DefinitionText.Full.Replace("[8, 128]", "[8, 127]", StringComparison.Ordinal), "/defs/f.json", "/defs");

        // Then records alone call the equal reads different (arrays compare by reference); the comparer does not
        Assert.NotEqual(a, b);
        Assert.Equal(a, b, DefinitionComparer.Instance);
        Assert.NotEqual(a, c, DefinitionComparer.Instance);
        Assert.Equal(DefinitionComparer.Instance.GetHashCode(a), DefinitionComparer.Instance.GetHashCode(b));
    }
}
