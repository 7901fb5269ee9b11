using Foldwise.Storage;

namespace Foldwise.Cli.Tests.Inspection;

public sealed class EarlierStoreTests
{
    [Fact]
    public void A_store_written_before_the_renames_still_opens_for_history_and_show()
    {
        // Given a store of format 1 written before the renames (its kept definition says min_rounds / max_rounds and int;
        // Foldwise.Tuning.Tests/Fixtures/StoreFormat1/README.md says how it was made), copied to a folder
        using var workspace = new Workspace();
        string store = workspace.PathOf(StoreFile.FileName);
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Fixtures", "StoreFormat1", StoreFile.FileName), store);

        // When a lead lists its trials and shows a promoted one
        var history = CliHarness.Run("history", store);
        var show = CliHarness.Run("show", store, "6");

        // Then both read it: ten trials, and trial 6 at rung 1 of 30 rounds
        Assert.True(history.ExitCode == 0, history.Output);
        Assert.Contains("10 trial(s)", history.Output);
        Assert.True(show.ExitCode == 0, show.Output);
        Assert.Contains("1, 30 rounds", show.Output);
    }
}
