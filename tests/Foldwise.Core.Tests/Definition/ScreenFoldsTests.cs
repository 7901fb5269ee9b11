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

    [Theory]
    [InlineData(""" "folds": 5 """)]
    [InlineData(""" "schedule": { "kind": "asha" } """)]
    [InlineData(""" "schedule": { "full_budget": 300 } """)]
    public void Without_the_key_an_ASHA_schedule_races_over_one_fold_with_eta_5(string rest)
    {
        var d = Read(rest);
        Assert.Equal((ScheduleKind.Asha, 1, 5), (d.Schedule.Kind, d.Schedule.ScreenFolds, d.Schedule.Eta));
    }

    [Theory]
    [InlineData(""" "schedule": { "first_rung": 20 } """, 3)]
    [InlineData(""" "schedule": { "screen_folds": 0 } """, 3)]
    [InlineData(""" "schedule": { "screen_folds": 0, "eta": 9 } """, 9)]
    public void Rungs_count_rounds_when_the_schedule_writes_its_first_rung_or_screens_no_folds(string rest, int eta)
    {
        var d = Read(rest);
        Assert.Equal((0, eta), (d.Schedule.ScreenFolds, d.Schedule.Eta));

        // And writing it says so, so that reading it back does not race over folds
        Assert.Contains("\"screen_folds\": 0", DefinitionWriter.Write(d), StringComparison.Ordinal);
        Assert.Equal(d.Schedule, DefinitionReader.Parse(DefinitionWriter.Write(d), "s.json", "/w").Schedule);
    }

    [Fact]
    public void Hyperband_and_the_full_budget_schedule_never_screen_on_folds()
    {
        Assert.False(Read(""" "schedule": { "kind": "hyperband" } """).Schedule.ByFolds);
        Assert.False(Read(""" "schedule": { "kind": "full" } """).Schedule.ByFolds);
        Assert.DoesNotContain("screen_folds", DefinitionWriter.Write(Read(""" "schedule": { "kind": "full" } """)), StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(""" "folds": 5, "schedule": { "kind": "asha", "screen_folds": 5 } """, "'schedule.screen_folds' (5) must be below the plan's 5 folds", "5 }")]
    [InlineData(""" "schedule": { "kind": "hyperband", "screen_folds": 1 } """, "'schedule.screen_folds' applies to the asha schedule only, not 'hyperband'", "1 }")]
    [InlineData(""" "schedule": { "kind": "asha", "screen_folds": -1 } """, "'schedule.screen_folds' must be at least 0", "-1 }")]
    public void A_screen_the_plan_cannot_give_is_refused_at_its_place(string rest, string message, string pointedAt)
    {
        string text = $$"""{ {{Data}}, {{rest}} }""";
        var error = Assert.Throws<InputException>(() => DefinitionReader.Parse(text, "s.json", "/w"));
        Assert.Contains(message, error.Message, StringComparison.Ordinal);
        Assert.Equal(DefinitionText.PositionOf(text, pointedAt), (error.Line!.Value, error.Column!.Value));
    }
}
