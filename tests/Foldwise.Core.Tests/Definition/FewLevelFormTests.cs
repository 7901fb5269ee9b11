using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Encodings;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Definition;

public sealed class FewLevelFormTests
{
    private const string Data = """ "data": { "train": "a.csv", "test": "b.csv", "id": "i", "target": "y" } """;

    private static SearchDefinition Read(string rest) => DefinitionReader.Parse($$"""{ {{Data}}, {{rest}} }""", "s.json", "/w");

    [Fact]
    public void Lightgbm_reads_its_default_form_unless_the_definition_chooses_the_other()
    {
        // Given one definition leaving the choice out and one choosing indicators, one choosing splits
        var standard = Read(""" "families": { "lightgbm": {}, "fasttree": {} } """);
        var indicators = Read(""" "families": { "lightgbm": { "few_level_categories": "indicators" }, "fasttree": {} } """);
        var splits = Read(""" "families": { "lightgbm": { "few_level_categories": "splits" } } """);

        // Then LightGBM takes its descriptor's first form, or the one chosen; FastTree always reads indicators
        Assert.Equal(FamilyDescriptors.LightGbm.FewLevelForms[0], standard.Families[0].FewLevelsForm);
        Assert.Equal(CategoryEncodingKind.Indicators, standard.Families[1].FewLevelsForm);
        Assert.Empty(indicators.LevelCodeFamilies());
        Assert.Equal([FamilyNames.LightGbm], splits.LevelCodeFamilies().ToArray());
    }

    [Fact]
    public void The_choice_survives_a_write_and_a_read_and_the_comparer_sees_it()
    {
        // Given LightGBM told to read indicators
        var d = Read(""" "families": { "lightgbm": { "few_level_categories": "indicators" } } """);

        // When it is written and read back
        string text = DefinitionWriter.Write(d);
        var back = DefinitionReader.Parse(text, "/x/y.json", "/x");

        // Then the key is spelled out and kept, and a definition choosing splits differs
        Assert.Contains("\"few_level_categories\": \"indicators\"", text, StringComparison.Ordinal);
        Assert.Equal(d, back, DefinitionComparer.Instance);
        var other = d with { Families = [d.Families[0] with { FewLevels = CategoryEncodingKind.LevelCodes }] };
        Assert.NotEqual(d, other, DefinitionComparer.Instance);
    }

    [Fact]
    public void A_stored_definition_written_before_the_choice_existed_reads_as_indicators()
    {
        // Given the text a store kept before families could choose: LightGBM without the key
        string stored = $$"""{ {{Data}}, "families": { "lightgbm": {} } }""";

        // When the store's text is read
        var d = DefinitionReader.ParseStored(stored, "s.db", "/w");

        // Then LightGBM reads indicators, as every family did when that search ran
        Assert.Equal(CategoryEncodingKind.Indicators, d.Families[0].FewLevelsForm);
    }

    [Fact]
    public void A_family_that_reads_only_indicators_refuses_the_key_and_a_wrong_word_names_the_valid_ones()
    {
        var onFastTree = Assert.Throws<InputException>(() => Read(""" "families": { "fasttree": { "few_level_categories": "splits" } } """));
        var wrongWord = Assert.Throws<InputException>(() => Read(""" "families": { "lightgbm": { "few_level_categories": "codes" } } """));

        Assert.Contains("unknown parameter 'families.fasttree.few_level_categories'", onFastTree.Message, StringComparison.Ordinal);
        Assert.Contains("splits, indicators", wrongWord.Message, StringComparison.Ordinal);
    }
}
