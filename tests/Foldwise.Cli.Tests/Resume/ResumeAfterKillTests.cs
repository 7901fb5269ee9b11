using System.Globalization;
using Foldwise.Cli.Tests.Processes;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Resume;

[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class ResumeAfterKillTests : IDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(120);
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public async Task A_killed_search_leaves_no_process_behind_and_resumes_to_its_budget_keeping_every_finished_trial_once()
    {
        // Given a search of 14 trials running in its own process, its launched PID alone killed (SIGKILL) after three
        // trials have finished
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 14);
        string store = Path.Combine(workspace.Out, "search.db");
        Dictionary<int, double> printed;
        using (var run = FoldwiseProcess.Start("run", definition, "--out", workspace.Out))
        {
            Assert.True(await run.WaitForLineAsync(IsTrialLine, Patience) && await WaitForTrialLinesAsync(run, 3), run.Output);
            run.KillLaunchedOnly();
            printed = run.Lines.Where(IsTrialLine).Select(ParseTrialLine).ToDictionary(t => t.Id, t => t.Score);
        }

        // (nothing the search started keeps running and holding its store)
        Assert.Empty(FoldwiseProcess.ProcessesMentioning(definition));
        var beforeResume = StoredTrial.Read(store);

        // When the search is resumed
        using var resume = FoldwiseProcess.Start("resume", workspace.Out);
        int code = await resume.WaitForExitAsync(Patience);

        // Then every trial done before the kill is still there with the same score, the budget is reached,
        // no trial id or piece of work appears twice, and the prediction file has one row per test id
        Assert.True(code == 0, resume.Output);
        Assert.Contains(resume.Lines, l => l.StartsWith("Resuming ", StringComparison.Ordinal));
        var after = StoredTrial.Read(store).ToDictionary(t => t.Id);
        foreach (var (id, score) in printed)
        {
            // The progress line shows the score with five decimals (ProgressView's F5 format).
            Assert.Equal(score, Math.Round(after[id].Score!.Value, 5), 5);
        }

        foreach (var done in beforeResume.Where(t => t.State == "done"))
        {
            Assert.Equal(done, after[done.Id]);
        }

        Assert.Equal(14, after.Count);
        Assert.All(after.Values, t => Assert.Equal("done", t.State));
        Assert.Equal(after.Count, after.Values.Select(t => t.WorkKey).Distinct().Count());
        var predictions = File.ReadAllLines(Path.Combine(workspace.Out, "predictions.csv"));
        Assert.Equal(Enumerable.Range(0, 20).Select(r => $"b{r}"), predictions.Skip(1).Select(l => l.Split(',')[0]));
    }

    internal static bool IsTrialLine(string line) => line.StartsWith("trial ", StringComparison.Ordinal);

    internal static async Task<bool> WaitForTrialLinesAsync(FoldwiseProcess process, int count) =>
        await process.WaitForLineAsync(_ => process.Lines.Count(IsTrialLine) >= count, Patience);

    /// <summary>"trial    3 lightgbm  rung 0    5 rounds 0.57515 …" → (3, 0.57515).</summary>
    internal static (int Id, double Score) ParseTrialLine(string line)
    {
        string[] words = line.Split(' ', StringSplitOptions.RemoveEmptyEntries);
        int rounds = Array.IndexOf(words, "rounds");
        return (int.Parse(words[1], CultureInfo.InvariantCulture), double.Parse(words[rounds + 1], CultureInfo.InvariantCulture));
    }
}
