using Foldwise.Cli.Tests.Processes;
using Foldwise.Cluster.Hosting;
using Foldwise.Core.Events;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>A coordinator process with the cluster certificate, and worker processes without it and with another cluster's.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class TlsRefusalTests
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(60);

    [Fact]
    public async Task A_worker_refused_by_mutual_tls_says_why_within_seconds_and_the_coordinator_logs_its_address()
    {
        // Given a coordinator that requires cluster alpha's certificate (no slots of its own: the search waits)
        using var workspace = new Workspace();
        string definition = MachineDefinition.Write(workspace, trials: 10);
        int port = MachineDefinition.FreePortPair();
        string alpha = Export(workspace, "alpha");
        string beta = Export(workspace, "beta");
        using var coordinator = FoldwiseProcess.Start(
            "run", definition, "--out", workspace.Out, "--slots", "0", "--port", port.ToString(), "--cert", alpha, "--passphrase", "pw");
        Assert.True(await coordinator.WaitForLineAsync(l => l.Contains("Coordinator listening", StringComparison.Ordinal), Patience), coordinator.Output);

        // When a worker without a certificate joins, then one with cluster beta's
        using var plain = FoldwiseProcess.Start("worker", "--join", $"127.0.0.1:{port}", "--name", "plain", "--json");
        int plainExit = await plain.WaitForExitAsync(Patience);
        using var stranger = FoldwiseProcess.Start("worker", "--join", $"127.0.0.1:{port}", "--name", "stranger", "--cert", beta, "--passphrase", "pw", "--json");
        int strangerExit = await stranger.WaitForExitAsync(Patience);

        // Then each leaves with exit code 5 and one event saying what is wrong
        Assert.True(plainExit == ExitCodes.Refused, plain.Output);
        Assert.Contains(plain.Lines, l => WorkerEvents.Is<WorkerRefused>(l) && l.Contains("the coordinator requires the cluster certificate", StringComparison.Ordinal));
        Assert.True(strangerExit == ExitCodes.Refused, stranger.Output);
        Assert.Contains(stranger.Lines, l => WorkerEvents.Is<WorkerRefused>(l) && l.Contains("belongs to another cluster", StringComparison.Ordinal));

        // And the coordinator logged each refused address with the reason
        Assert.True(
            await coordinator.WaitForLineAsync(l => l.Contains("Refused a connection from 127.0.0.1:", StringComparison.Ordinal) && l.Contains("did not present the cluster certificate", StringComparison.Ordinal), TimeSpan.FromSeconds(5)),
            coordinator.Output);
        Assert.Contains(coordinator.Lines, l => l.Contains("Refused a connection from 127.0.0.1:", StringComparison.Ordinal) && l.Contains("CN=foldwise cluster beta", StringComparison.Ordinal));
        coordinator.Kill();
    }

    private static string Export(Workspace workspace, string cluster)
    {
        using var certificate = ClusterCertificate.Create(cluster);
        string path = workspace.PathOf(cluster + ".pfx");
        ClusterCertificate.Export(certificate, path, "pw");
        return path;
    }
}
