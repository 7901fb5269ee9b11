using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class DefinitionReaderTests
{
    [Fact]
    public void Reads_the_demo_config_with_its_paths_beside_it()
    {
        // Given the repository's demo definition
        string path = DefinitionText.RepositoryFile("configs/demo.json");
        string folder = Path.GetDirectoryName(path)!;

        // When it is read
        var d = DefinitionReader.Read(path);

        // Then every key the demo sets is there, and the data paths resolve from the file's folder to where `demo --data-only` writes
        Assert.Equal("freight-demo", d.Name);
        Assert.Equal(Path.GetFullPath(Path.Combine(folder, "..", "runs", "demo-data", "train.csv")), d.Data.Train);
        Assert.Equal(Path.GetFullPath(Path.Combine(folder, "..", "runs", "demo-data", "test.csv")), d.Data.Test);
        Assert.Equal(("shipper_id", "q1_spend"), (d.Data.IdColumn, d.Data.TargetColumn));
        Assert.Equal(MetricKind.Rmsle, d.Metric);
        Assert.Equal([FamilyNames.LightGbm, FamilyNames.FastTree], d.Families.Select(f => f.Family));
        Assert.True(DefinitionComparer.SameSpace(DefaultSpaces.LightGbm, d.Families[0].Space));
        Assert.True(DefinitionComparer.SameSpace(DefaultSpaces.FastTree, d.Families[1].Space));
        Assert.Equal(new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, 25, 400, 5, ScreenFolds: 1), d.Schedule);
        Assert.Equal(new SearchBudget(60, null), d.Budget);
        Assert.Equal(new BlendOptions(BlendMode.Simplex, 3), d.Blend);
    }

    [Fact]
    public void Reads_every_key_of_a_full_definition()
    {
        // Given a definition that sets every key
        // When it is parsed
        var d = DefinitionReader.Parse(DefinitionText.Full, "/defs/full.json", DefinitionText.Folder);

        // Then each value lands in its record
        Assert.Equal("freight-test", d.Name);
        Assert.Equal(new DataSource("/defs/train.csv", "/defs/test.csv", "shipper_id", "q1_spend"), d.Data);
        Assert.Equal((5, 7, 3), (d.Folds, d.Seed, d.Screening.MinNonZero));
        Assert.Equal(new SearchBudget(60, 2.0), d.Budget);
    }

    [Fact]
    public void A_family_object_replaces_only_the_parameters_it_names()
    {
        // Given lightgbm with its learning rate, leaves and a fixed row fraction named
        var d = DefinitionReader.Parse(DefinitionText.Full, "/defs/full.json", DefinitionText.Folder);
        var space = d.Families.Single(f => f.Family == FamilyNames.LightGbm).Space;

        // Then those three change, the rest keep their defaults, and the default order holds
        Assert.Equal(DefaultSpaces.LightGbm.Ranges.Select(r => r.Name), space.Ranges.Select(r => r.Name));
        Assert.Equal(ParameterRange.Fixed("row_fraction", 0.8), space.Find("row_fraction"));
        Assert.Equal(ParameterRange.Whole("leaves", 8, 128), space.Find("leaves"));
        Assert.Equal(DefaultSpaces.LightGbm.Find("l2"), space.Find("l2"));
        Assert.Equal(DefaultSpaces.LightGbm.Find("min_leaf_rows"), space.Find("min_leaf_rows"));
    }

    [Fact]
    public void A_fixed_whole_number_parameter_stays_whole()
    {
        // Given leaves fixed at 31
        string json = """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" }, "families": { "fasttree": { "leaves": 31 } } }""";

        // When it is parsed
        var leaves = DefinitionReader.Parse(json, "/defs/x.json", "/defs").Families.Single().Space.Find("leaves")!;

        // Then it is an integer range of one value, so 31.5 is still refused
        Assert.Equal((ParameterKind.Whole, 31.0, 31.0), (leaves.Kind, leaves.Low, leaves.High));
        Assert.False(leaves.Contains(31.5));
    }

    [Fact]
    public void Fills_every_key_a_file_leaves_out_with_its_default()
    {
        // Given only the data section
        string json = """{ "data": { "train": "sub/a.csv", "test": "/abs/b.csv", "id": "i", "target": "y" } }""";

        // When it is parsed
        var d = DefinitionReader.Parse(json, "/defs/quarterly.json", "/defs");

        // Then the name comes from the file, paths are absolute, and the rest are the records' defaults (the schedule's
        // for a definition: racing over folds)
        Assert.Equal("quarterly", d.Name);
        Assert.Equal(("/defs/sub/a.csv", "/abs/b.csv"), (d.Data.Train, d.Data.Test));
        Assert.Equal((MetricKind.Rmsle, 5, 1), (d.Metric, d.Folds, d.Seed));
        Assert.Equal(new Foldwise.Core.Screening.ScreeningOptions(), d.Screening);
        Assert.Equal(ScheduleDefaults.Standard, d.Schedule);
        Assert.Equal(new BlendOptions(), d.Blend);
        Assert.Equal(new SearchBudget(DefinitionDefaults.Trials, null), d.Budget);
        Assert.Equal(FamilyNames.Default, d.Families.Select(f => f.Family));
        Assert.True(d.Families.All(f => DefinitionComparer.SameSpace(DefaultSpaces.For(f.Family), f.Space)));
    }

    [Fact]
    public void A_partial_section_keeps_the_defaults_of_the_keys_it_leaves_out()
    {
        // Given a schedule that only names its kind and a blend that only names its pool
        string json = """
            { "data": { "train": "a", "test": "b", "id": "i", "target": "y" },
              "schedule": { "kind": "hyperband" }, "blend": { "pool": 5 }, "budget": { "hours": 0.5 } }
            """;

        // When it is parsed
        var d = DefinitionReader.Parse(json, "/defs/x.json", "/defs");

        // Then the other schedule and blend keys keep their defaults, and the budget is hours only
        Assert.Equal(new ScheduleOptions() with { Kind = ScheduleKind.Hyperband }, d.Schedule);
        Assert.Equal(new BlendOptions(BlendMode.Simplex, 5), d.Blend);
        Assert.Equal(new SearchBudget(null, 0.5), d.Budget);
    }

    [Fact]
    public void Allows_comments_and_trailing_commas()
    {
        // Given a definition with both kinds of comment and trailing commas
        string json = """
            // line comment
            { "data": { "train": "a", "test": "b", "id": "i", "target": "y", }, /* block */
              "metric": "mae", }
            """;

        // When it is parsed
        var d = DefinitionReader.Parse(json, "/defs/x.json", "/defs");

        // Then they are skipped
        Assert.Equal(MetricKind.Mae, d.Metric);
    }

    [Fact]
    public void Reads_a_file_that_starts_with_a_byte_order_mark()
    {
        // Given a definition file saved with a UTF-8 byte order mark
        string dir = Directory.CreateTempSubdirectory("foldwise-def-").FullName;
        string path = Path.Combine(dir, "bom.json");
        File.WriteAllText(path, """{ "data": { "train": "a", "test": "b", "id": "i", "target": "y" } }""", new System.Text.UTF8Encoding(true));

        // When it is read
        var d = DefinitionReader.Read(path);

        // Then the mark is skipped and paths sit beside the file
        Assert.Equal(Path.Combine(dir, "a"), d.Data.Train);
        Directory.Delete(dir, true);
    }

    [Fact]
    public void A_missing_file_is_an_input_error_naming_it()
    {
        // When a file that does not exist is read
        var e = Assert.Throws<Foldwise.Core.Data.InputException>(() => DefinitionReader.Read("/no/such/dir/def.json"));

        // Then the error names the file
        Assert.Equal("/no/such/dir/def.json", e.File);
        Assert.Contains("cannot read", e.Problem);
    }
}
