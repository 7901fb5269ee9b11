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

    [Fact]
    [Trait(Lane.Key, Lane.Slow)]
    public async Task A_worker_started_before_its_coordinator_says_so_once_and_joins_when_it_comes()
    {
        // Given a worker joining a port where nothing listens yet
        int port = MachineDefinition.FreePortPair();
        using var output = new SynchronizedWriter();
        var worker = new WorkerHost(
            new ClusterRole { IsCoordinator = false, Join = new System.Net.IPEndPoint(System.Net.IPAddress.Loopback, port), SiloName = "early" },
            new WorkerOptions { Name = "early" },
            new WorkerLines(output)) { RetryPause = TimeSpan.FromMilliseconds(200) };
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(120));
        var running = worker.RunAsync(stop.Token);
        await Until(() => output.Text.Contains("Nothing answers", StringComparison.Ordinal), stop.Token);
        await Task.Delay(TimeSpan.FromSeconds(1), stop.Token);

        // When the coordinator starts on that port
        await using var coordinator = await EmbeddedCluster.StartAsync(
            new ClusterRole { SiloPort = port, GatewayPort = port + 1 }, slots: 0, threads: null, new FoldwiseTelemetryOptions(), NoEvents.Instance, CancellationToken.None);
        await Until(() => output.Text.Contains("Joined the cluster", StringComparison.Ordinal), stop.Token);
        await stop.CancelAsync();
        await running;

        // Then the wait was said once, in one line, and the worker joined (a join in the coordinator's first second may
        // still be retried once, with its own line)
        string text = output.Text;
        Assert.Equal(1, text.Split('\n').Count(l => l.StartsWith($"Nothing answers at 127.0.0.1:{port} yet", StringComparison.Ordinal)));
        Assert.Contains("Joined the cluster", text, StringComparison.Ordinal);
    }

    private static async Task Until(Func<bool> condition, CancellationToken stop)
    {
        while (!condition())
        {
            await Task.Delay(100, stop);
        }
    }

    /// <summary>A text writer the worker's events may write to from several threads while the test reads it.</summary>
    private sealed class SynchronizedWriter : StringWriter
    {
        private readonly Lock gate = new();

        public string Text
        {
            get
            {
                lock (gate)
                {
                    return ToString();
                }
            }
        }

        public override void WriteLine(string? value)
        {
            lock (gate)
            {
                base.WriteLine(value);
            }
        }

        public override void Write(string? value)
        {
            lock (gate)
            {
                base.Write(value);
            }
        }
    }
}
