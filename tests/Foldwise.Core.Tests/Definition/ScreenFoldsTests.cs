using Foldwise.Core.Data;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Tests.Definition;

public sealed class ScreenFoldsTests
{
    private const string Data = """ "data": { "train": "a.csv", "test": "b.csv", "id": "i", "target": "y" } """;

    private static SearchDefinition Read(string rest) => DefinitionReader.Parse($$"""{ {{Data}}, {{rest}} }""", "s.json", "/w");

    [Fact]
    public void A_schedule_that_screens_on_folds_is_read_and_survives_a_write_and_a_read()
    {
        // Given an ASHA schedule that first trains each candidate on 1 of 5 folds
        var d = Read(""" "folds": 5, "schedule": { "kind": "asha", "eta": 5, "screen_folds": 1 } """);

        // Then it screens on folds, and writing it keeps that
        Assert.Equal((1, true, 5), (d.Schedule.ScreenFolds, d.Schedule.ByFolds, d.Schedule.Eta));
        var again = DefinitionReader.Parse(DefinitionWriter.Write(d), "s.json", "/w");
        Assert.Equal(d.Schedule, again.Schedule);
    }

    [Fact]
    public void Without_the_key_rungs_count_rounds_and_the_written_text_does_not_mention_it()
    {
        var d = Read(""" "schedule": { "kind": "asha" } """);
        Assert.False(d.Schedule.ByFolds);
        Assert.DoesNotContain("screen_folds", DefinitionWriter.Write(d), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(""" "folds": 5, "schedule": { "kind": "asha", "screen_folds": 5 } """, "'schedule.screen_folds' (5) must be below the plan's 5 folds", "5 }")]
    [InlineData(""" "schedule": { "kind": "hyperband", "screen_folds": 1 } """, "'schedule.screen_folds' applies to the asha schedule only, not 'hyperband'", "1 }")]
    [InlineData(""" "schedule": { "kind": "asha", "screen_folds": 0 } """, "'schedule.screen_folds' must be at least 1", "0 }")]
    public void A_screen_the_plan_cannot_give_is_refused_at_its_place(string rest, string message, string pointedAt)
    {
        string text = $$"""{ {{Data}}, {{rest}} }""";
        var error = Assert.Throws<InputException>(() => DefinitionReader.Parse(text, "s.json", "/w"));
        Assert.Contains(message, error.Message, StringComparison.Ordinal);
        Assert.Equal(DefinitionText.PositionOf(text, pointedAt), (error.Line!.Value, error.Column!.Value));
    }
}
