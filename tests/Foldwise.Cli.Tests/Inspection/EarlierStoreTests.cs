namespace Foldwise.Cli.Tests.Inspection;

public sealed class EarlierStoreTests
{
    [Fact]
    public void A_store_whose_definition_uses_retired_names_still_opens_for_history_and_show()
    {
        // Given a store written before the renames: its kept definition says min_rounds / max_rounds and int
        string earlier = InspectedStore.Definition
            .Replace("\"first_rung\"", "\"min_rounds\"", StringComparison.Ordinal)
            .Replace("\"full_budget\"", "\"max_rounds\"", StringComparison.Ordinal)
            .Replace("\"lightgbm\": {}", "\"lightgbm\": { \"leaves\": {\"int\": [8, 64]} }", StringComparison.Ordinal);
        Assert.Contains("min_rounds", earlier);
        using var store = new InspectedStore(definitionJson: earlier);

        // When a lead lists its trials and shows the promoted one
        var history = CliHarness.Run("history", store.Path);
        var show = CliHarness.Run("show", store.Path, "3");

        // Then both read the old names as the new ones
        Assert.True(history.ExitCode == 0, history.Output);
        Assert.Contains("6 trial(s)", history.Output);
        Assert.True(show.ExitCode == 0, show.Output);
        Assert.Contains("1, 15 rounds", show.Output);
    }
}
