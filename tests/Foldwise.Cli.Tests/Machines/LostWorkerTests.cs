using Foldwise.Cli.Tests.Processes;
using Foldwise.Core.Events;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>A coordinator process with no slots and two worker processes on loopback; one worker is SIGKILLed mid-trial.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class LostWorkerTests
{
    [Fact]
    public async Task Finishes_every_trial_exactly_once_when_a_worker_is_killed_mid_trial_and_gives_work_to_a_late_joiner()
    {
        // Given a coordinator that trains nothing itself, with 3 s leases, and one worker
        using var workspace = new Workspace();
        string definition = MachineDefinition.Write(workspace, trials: 10);
        int port = MachineDefinition.FreePortPair();
        using var coordinator = FoldwiseProcess.Start(
            "run", definition, "--out", workspace.Out, "--slots", "0", "--port", port.ToString(), "--lease-seconds", "3");
        Assert.True(await coordinator.WaitForLineAsync(l => l.Contains("Coordinator listening", StringComparison.Ordinal), TimeSpan.FromSeconds(60)), coordinator.Output);
        using var first = Worker(workspace, port, "w1");
        Assert.True(await first.WaitForLineAsync(WorkerEvents.Is<SlotTrialScored>, TimeSpan.FromSeconds(60)), first.Output + coordinator.Output);

        // When a second worker joins late, and the first is killed while it holds a lease (frozen first, so the trial
        // it runs cannot finish between the look at the store and the kill)
        using var late = Worker(workspace, port, "w2");
        Assert.True(await FreezeWhileRunning(first, workspace.Out, "w1", TimeSpan.FromSeconds(60)), "w1 was never caught holding a lease");
        first.Kill();

        // Then the search still finishes, every trial done once, the lost attempt on record
        int code = await coordinator.WaitForExitAsync(TimeSpan.FromSeconds(90));
        Assert.True(code == 0, coordinator.Output + "\n--- w2\n" + late.Output);
        var trials = MachineDefinition.History(workspace.Out);
        var ids = trials.Select(t => (int)t!["id"]!).ToList();
        Assert.Equal(10, ids.Count);
        Assert.Equal(ids.Count, ids.Distinct().Count());
        Assert.All(trials, t => Assert.Equal("done", (string)t!["state"]!));
        Assert.Contains(trials, t => t!["lost_attempts"]!.AsArray().Any(a => ((string)a!).Contains("lease expired on w1", StringComparison.Ordinal)));
        Assert.Contains(trials, t => (string?)t!["worker"] == "w2");
        Assert.Contains(late.Lines, WorkerEvents.Is<SlotTrialScored>);
    }

    private static FoldwiseProcess Worker(Workspace workspace, int port, string name) =>
        FoldwiseProcess.Start(
            "worker", "--join", $"127.0.0.1:{port}", "--slots", "1", "--threads", "1", "--name", name,
            "--cache", Path.Combine(workspace.Root, "cache-" + name), "--json");

    /// <summary>
    /// Stops the worker's process (SIGSTOP) once the store shows it running a trial, and keeps it stopped if the store
    /// still shows that after in-flight messages have landed; otherwise lets it go on (SIGCONT) and waits again.
    /// </summary>
    private static async Task<bool> FreezeWhileRunning(FoldwiseProcess worker, string outDir, string name, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (!await WaitUntilRunningOn(outDir, name, deadline - DateTime.UtcNow))
            {
                return false;
            }

            await SignalAsync(worker.Id, "-STOP");
            await Task.Delay(500);
            if (IsRunningOn(outDir, name))
            {
                return true;
            }

            await SignalAsync(worker.Id, "-CONT");
        }

        return false;
    }

    private static bool IsRunningOn(string outDir, string worker) =>
        MachineDefinition.History(outDir).Any(t => (string?)t!["state"] == "running" && (string?)t["worker"] == worker);

    private static async Task SignalAsync(int pid, string signal)
    {
        using var kill = System.Diagnostics.Process.Start("kill", [signal, pid.ToString(System.Globalization.CultureInfo.InvariantCulture)]);
        await kill.WaitForExitAsync();
        Assert.Equal(0, kill.ExitCode);
    }

    private static async Task<bool> WaitUntilRunningOn(string outDir, string worker, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (IsRunningOn(outDir, worker))
            {
                return true;
            }

            await Task.Delay(100);
        }

        return false;
    }
}
