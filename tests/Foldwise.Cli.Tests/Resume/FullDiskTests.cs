using Foldwise.Cli.Tests.Processes;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Resume;

/// <summary>A search whose store cannot grow (a file-size limit standing in for a full disk), then resumed with room.</summary>
[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class FullDiskTests : IDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(120);
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public async Task A_store_that_cannot_grow_stops_the_search_with_the_reason_and_resume_keeps_every_committed_trial()
    {
        // Given a 40-trial search whose files may not grow past 160 KiB (measured on this table: the store starts near
        // 115 KiB and grows a few KiB per trial, so the limit is reached after some trials, well before 40)
        workspace.WriteTables(trainRows: 300, testRows: 50);
        string definition = workspace.WriteDefinition(trials: 40);
        string store = Path.Combine(workspace.Out, "search.db");
        using var run = FoldwiseProcess.StartWithFileSizeLimit(160, "run", definition, "--out", workspace.Out, "--slots", "1", "--threads", "1");
        int code = await run.WaitForExitAsync(Patience);

        // Then it stops with exit code 3 and one line saying the store refused a write, what is kept and how to go on
        Assert.True(code == ExitCodes.Failed, run.Output);
        Assert.Contains(run.Lines, l => l.StartsWith("Stopped: the store in", StringComparison.Ordinal) && l.Contains("refused a write", StringComparison.Ordinal));
        Assert.Contains("foldwise resume", run.Output, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(workspace.Out, "predictions.csv")));

        // And every trial it printed as scored is in the store, done, with that score
        var printed = run.Lines.Where(ResumeAfterKillTests.IsTrialLine).Select(ResumeAfterKillTests.ParseTrialLine).ToDictionary(t => t.Id, t => t.Score);
        var stopped = StoredTrial.Read(store);
        Assert.InRange(printed.Count, 1, 39);
        Assert.All(printed, p => Assert.Equal(p.Value, stopped.Single(t => t.Id == p.Key && t.State == "done").Score!.Value, 5));

        // When the search is resumed with room to grow
        using var resume = FoldwiseProcess.Start("resume", workspace.Out, "--slots", "1", "--threads", "1");
        Assert.True(await resume.WaitForExitAsync(Patience) == 0, resume.Output);

        // Then it reaches its budget, every trial done before the stop kept with the same score
        var finished = StoredTrial.Read(store);
        Assert.Equal(40, finished.Count(t => t.State == "done"));
        Assert.All(stopped.Where(t => t.State == "done"), t => Assert.Equal(t.Score, finished.Single(f => f.Id == t.Id).Score));
        Assert.True(File.Exists(Path.Combine(workspace.Out, "predictions.csv")));
    }
}
