using Foldwise.Storage;
using Foldwise.Testing;
using Foldwise.Tuning;
using LiteDB;

namespace Foldwise.Cli.Tests.Resume;

[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class ResumeCommandTests : IDisposable
{
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    private string Store => Path.Combine(workspace.Out, "search.db");

    [Fact]
    public void A_store_killed_before_its_header_is_started_over_and_a_finished_search_is_left_alone()
    {
        // Given a store that was created but killed before its first record
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 3);
        SearchStore.Create(Store).Dispose();

        // When it is resumed, then resume explains that nothing ran and how to start again
        var resume = CliHarness.Run("resume", workspace.Out);
        Assert.Equal(1, resume.ExitCode);
        Assert.Contains("no trial ran. Start it again with 'foldwise run' (the same --out works)", resume.Output);

        // When the search is run into the same folder, then it starts over and finishes
        var run = CliHarness.Run("run", definition, "--out", workspace.Out);
        Assert.True(run.ExitCode == 0, run.Output);

        // When the finished search is resumed, then it says so, exits 0 and writes nothing
        string predictions = Path.Combine(workspace.Out, "predictions.csv");
        File.Delete(predictions);
        var again = CliHarness.Run("resume", Store);
        Assert.Equal(0, again.ExitCode);
        Assert.Contains("finished already", again.Output);
        Assert.False(File.Exists(predictions));

        // When it is resumed with --blend, then the blend runs again and the predictions are rewritten
        var reblend = CliHarness.Run("resume", Store, "--blend");
        Assert.True(reblend.ExitCode == 0, reblend.Output);
        Assert.Equal(21, File.ReadAllLines(predictions).Length);
    }

    [Fact]
    public void A_missing_or_altered_table_file_is_named_with_how_to_recover()
    {
        // Given an unfinished search whose kept training table is then lost, or altered
        workspace.WriteTables();
        var run = CliHarness.Run("run", workspace.WriteDefinition(trials: 2), "--out", workspace.Out);
        Assert.True(run.ExitCode == 0, run.Output);
        string trainHash;
        using (var store = SearchStore.Open(Store))
        {
            var header = store.LoadHeader()!;
            trainHash = header.TrainHash;
            store.UpdateSpent(header.SpentSeconds, finished: false);
        }

        string table = TableFiles.PathOf(workspace.Out, trainHash);
        byte[] original = File.ReadAllBytes(table);
        File.Delete(table);

        // When it is resumed, then the missing file is named, with the way back, exit 1
        var missing = CliHarness.Run("resume", workspace.Out);
        Assert.Equal(1, missing.ExitCode);
        Assert.Contains(table, missing.Output);
        Assert.Contains("screened training table is missing", missing.Output);
        Assert.Contains("'foldwise run' into a new --out folder", missing.Output);

        // When the file comes back with one byte changed, then its hash mismatch is reported, exit 1
        original[^1] ^= 0xFF;
        File.WriteAllBytes(table, original);
        var altered = CliHarness.Run("resume", workspace.Out);
        Assert.Equal(1, altered.ExitCode);
        Assert.Contains("was altered", altered.Output);
    }

    [Fact]
    public void A_store_from_a_newer_foldwise_is_refused_by_resume_and_history_with_exit_1()
    {
        // Given a store whose format record says a newer format (99) than this build reads
        SearchStore.Create(Store).Dispose();
        using (var db = new LiteDatabase(new ConnectionString { Filename = Store, Connection = ConnectionType.Shared }))
        {
            var meta = db.GetCollection("meta");
            var format = meta.FindById("format");
            format["version"] = 99;
            meta.Update(format);
        }

        // When resume and history open it
        var resume = CliHarness.Run("resume", Store);
        var history = CliHarness.Run("history", Store);

        // Then both refuse with the clear error and exit 1
        Assert.Equal(1, resume.ExitCode);
        Assert.Contains("was written by a newer Foldwise (store format 99)", resume.Output);
        Assert.Equal(1, history.ExitCode);
        Assert.Contains("was written by a newer Foldwise (store format 99)", history.Output);
    }
}
