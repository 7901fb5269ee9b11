using Foldwise.Cli.Tests.Processes;
using Foldwise.Core.Events;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>A worker process outlives its coordinator: the coordinator is SIGKILLed and resumed on the same port.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class CoordinatorRestartTests
{
    [Fact]
    public async Task A_worker_rejoins_a_restarted_coordinator_by_itself_and_the_search_finishes_every_trial_once()
    {
        // Given a coordinator that trains nothing itself and one worker that has scored a trial
        using var workspace = new Workspace();
        string definition = MachineDefinition.Write(workspace, trials: 14);
        int port = MachineDefinition.FreePortPair();
        string[] host = ["--slots", "0", "--port", port.ToString(), "--lease-seconds", "3"];
        using var first = FoldwiseProcess.Start(["run", definition, "--out", workspace.Out, .. host]);
        Assert.True(await first.WaitForLineAsync(l => l.Contains("Coordinator listening", StringComparison.Ordinal), TimeSpan.FromSeconds(60)), first.Output);
        using var worker = FoldwiseProcess.Start(
            "worker", "--join", $"127.0.0.1:{port}", "--slots", "1", "--threads", "1", "--name", "w1",
            "--cache", Path.Combine(workspace.Root, "cache"), "--json");
        Assert.True(await worker.WaitForLineAsync(WorkerEvents.Is<SlotTrialScored>, TimeSpan.FromSeconds(60)), worker.Output + first.Output);

        // When the coordinator is killed and resumed from its store on the same port
        first.Kill();
        int doneBefore = MachineDefinition.History(workspace.Out).Count(t => (string?)t!["state"] == "done");
        using var second = FoldwiseProcess.Start(["resume", workspace.Out, .. host]);

        // Then the worker notices, joins the new coordinator without being restarted, and the search finishes
        int code = await second.WaitForExitAsync(TimeSpan.FromSeconds(180));
        Assert.True(code == 0, second.Output + "\n--- worker\n" + worker.Output);
        Assert.False(worker.HasExited, worker.Output);
        var lines = worker.Lines.ToList();
        int rejoined = lines.FindLastIndex(WorkerEvents.Is<WorkerJoined>);
        Assert.True(lines.Count(WorkerEvents.Is<WorkerJoined>) >= 2, worker.Output);
        Assert.Contains(lines.Skip(rejoined), WorkerEvents.Is<SlotTrialScored>);
        // The command's banner again: the worker started over as a fresh process (same PID, execv), not a rebuilt silo.
        Assert.True(lines.Count(WorkerEvents.Is<WorkerStarting>) >= 2, worker.Output);

        var trials = MachineDefinition.History(workspace.Out);
        var ids = trials.Select(t => (int)t!["id"]!).ToList();
        Assert.Equal(14, ids.Count);
        Assert.Equal(ids.Count, ids.Distinct().Count());
        Assert.All(trials, t => Assert.Equal("done", (string)t!["state"]!));
        Assert.True(doneBefore < 14, $"the search had finished before the kill ({doneBefore} done): the test proves nothing");
    }
}
