using Foldwise.Cli.Tests.Processes;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Machines;

/// <summary><c>status HOST:PORT</c> asks a running coordinator process through its gateway, on loopback.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class LiveStatusTests
{
    [Fact]
    public async Task Reads_live_progress_from_a_running_coordinator_through_its_gateway()
    {
        // Given a coordinator process running a search with one local single-threaded slot (two OpenMP threads spin
        // while they wait, which on a busy test machine held the first trial back past the wait below)
        using var workspace = new Workspace();
        string definition = MachineDefinition.Write(workspace, trials: 30);
        int port = MachineDefinition.FreePortPair();
        using var coordinator = FoldwiseProcess.Start("run", definition, "--out", workspace.Out, "--slots", "1", "--threads", "1", "--port", port.ToString());
        Assert.True(await coordinator.WaitForLineAsync(l => l.StartsWith("trial ", StringComparison.Ordinal), TimeSpan.FromSeconds(90)), coordinator.Output);

        // When status asks its gateway (silo port + 1)
        var status = CliHarness.Run("status", $"127.0.0.1:{port + 1}");

        // Then a person reads the search's live counts, budget and what runs where
        Assert.True(status.ExitCode == 0, status.Output + "\n--- coordinator\n" + coordinator.Output);
        Assert.Contains("(live): running.", status.Output);
        Assert.Matches(@"Trials: \d+ created: [1-9]\d* done, \d running, \d+ queued, 0 failed \(budget 30 trials\)\.", status.Output);
        Assert.Contains("Best lightgbm:", status.Output);
        Assert.Contains("Running now:", status.Output);
    }

    [Fact]
    public void Says_clearly_when_nothing_listens_at_the_address()
    {
        int port = MachineDefinition.FreePortPair();

        var status = CliHarness.Run("status", $"127.0.0.1:{port}");

        Assert.NotEqual(0, status.ExitCode);
        Assert.StartsWith("foldwise: no coordinator answered at 127.0.0.1:", status.Output.Trim(), StringComparison.Ordinal);
    }
}
