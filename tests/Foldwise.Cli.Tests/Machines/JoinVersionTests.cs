using Foldwise.Cli.Output;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Core;
using Foldwise.Core.Events;
using Foldwise.Testing;
using Foldwise.Tuning;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>A worker of another build is refused when it joins, with one line naming both versions.</summary>
public sealed class JoinVersionTests
{
    [Fact]
    public void The_refusal_names_both_versions_and_a_same_build_worker_is_admitted()
    {
        var other = new WorkerHello("office-pc-3", "0.0.1+000000000000", ["lightgbm"]);

        string? refusal = JoinRule.Refusal(other, BuildVersion.Text);

        Assert.Equal(
            $"worker office-pc-3 runs Foldwise 0.0.1+000000000000 but the coordinator runs Foldwise {BuildVersion.Text}; install {BuildVersion.Text} on the worker",
            refusal);
        Assert.Null(JoinRule.Refusal(other with { Version = BuildVersion.Text }, BuildVersion.Text));
        Assert.NotNull(JoinRule.Refusal(other with { Version = BuildVersion.Text, Families = [] }, BuildVersion.Text));
    }

    [Fact]
    [Trait(Lane.Key, Lane.Slow)]
    public async Task A_worker_of_another_build_stops_with_the_refusal_instead_of_working()
    {
        // Given a coordinator listening on loopback
        int port = MachineDefinition.FreePortPair();
        await using var coordinator = await EmbeddedCluster.StartAsync(
            new ClusterRole { SiloPort = port, GatewayPort = port + 1 }, slots: 0, threads: null, new FoldwiseTelemetryOptions(), NoEvents.Instance, CancellationToken.None);

        // When a worker claiming another build joins it
        using var output = new StringWriter();
        var worker = new WorkerHost(
            new ClusterRole { IsCoordinator = false, Join = new System.Net.IPEndPoint(System.Net.IPAddress.Loopback, port), SiloName = "old-build" },
            new WorkerOptions { Name = "old-build", Version = "0.0.1+000000000000" },
            new WorkerLines(output));
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(90));
        string? refusal = await worker.RunAsync(timeout.Token);

        // Then it leaves on its own, saying why, naming both versions
        Assert.False(timeout.IsCancellationRequested, output.ToString());
        Assert.Contains($"runs Foldwise 0.0.1+000000000000 but the coordinator runs Foldwise {BuildVersion.Text}", refusal);
        Assert.Contains("Cannot work for 127.0.0.1:" + port, output.ToString());
    }
}
