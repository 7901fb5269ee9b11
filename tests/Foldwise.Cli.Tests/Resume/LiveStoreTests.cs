using Foldwise.Cli.Tests.Processes;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Resume;

[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class LiveStoreTests : IDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(120);
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public async Task History_reads_a_running_search_without_blocking_it_and_a_second_writer_is_refused()
    {
        // Given a search running in another process, past its first trial
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 14);
        string store = Path.Combine(workspace.Out, "search.db");
        using var run = FoldwiseProcess.Start("run", definition, "--out", workspace.Out);
        Assert.True(await ResumeAfterKillTests.WaitForTrialLinesAsync(run, 1), run.Output);

        // When a second coordinator tries to resume the same store meanwhile
        var second = CliHarness.Run("resume", workspace.Out);

        // Then it is refused with a clear error, exit 4 (store busy), and the running search is untouched
        Assert.Equal(ExitCodes.StoreBusy, second.ExitCode);
        Assert.Contains("Another process is writing", second.Output);

        // When history reads the store over and over while the search runs
        var doneCounts = new List<int>();
        while (!run.HasExited)
        {
            doneCounts.Add(StoredTrial.Read(store).Count(t => t.State == "done"));
        }

        // Then every read succeeded and saw the search only grow, and the search ran to its end unharmed
        Assert.True(await run.WaitForExitAsync(Patience) == 0, run.Output);
        Assert.True(doneCounts.Count >= 2, $"only {doneCounts.Count} reads while running");
        Assert.Equal(doneCounts.Order(), doneCounts);
        var final = StoredTrial.Read(store);
        Assert.Equal(14, final.Count(t => t.State == "done"));
    }
}
