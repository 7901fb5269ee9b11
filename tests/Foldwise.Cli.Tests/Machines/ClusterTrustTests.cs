using System.Diagnostics;
using Foldwise.Cli.Tests.Processes;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
using Foldwise.Testing;
using Foldwise.Tuning;
using Xunit.Abstractions;

namespace Foldwise.Cli.Tests.Machines;

/// <summary>An in-process coordinator with the cluster certificate, and worker processes with and without it.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class ClusterTrustTests(ITestOutputHelper output)
{
    [Fact]
    public async Task Refuses_a_silo_without_the_certificate_admits_one_with_it_and_notices_its_death_within_30_s()
    {
        // Given a coordinator that requires the cluster certificate
        using var workspace = new Workspace();
        using var certificate = ClusterCertificate.Create("test");
        var (pfx, port) = ExportAndPickPorts(workspace, certificate);
        await using var coordinator = await EmbeddedCluster.StartAsync(
            new ClusterRole { SiloPort = port, GatewayPort = port + 1, Certificate = certificate }, slots: 0, threads: null, new FoldwiseTelemetryOptions(), NoEvents.Instance, CancellationToken.None);

        // When a stranger without the certificate tries to join
        using var stranger = FoldwiseProcess.Start("worker", "--join", $"127.0.0.1:{port}", "--name", "stranger", "--json");
        bool strangerJoined = await stranger.WaitForLineAsync(WorkerEvents.Is<WorkerJoined>, TimeSpan.FromSeconds(12));

        // Then it is refused: never a member, never joined
        Assert.False(strangerJoined, stranger.Output);
        Assert.Single(coordinator.Members.Active);
        stranger.Kill();

        // When a worker with the certificate joins, it becomes a member
        using var member = FoldwiseProcess.Start("worker", "--join", $"127.0.0.1:{port}", "--name", "member", "--cert", pfx, "--passphrase", "test-passphrase");
        Assert.True(await WaitFor(() => coordinator.Members.Active.Count == 2, TimeSpan.FromSeconds(40)), member.Output);
        Assert.Contains(coordinator.Members.Active, m => m.EndsWith("(member)", StringComparison.Ordinal));

        // And when it is SIGKILLed, the coordinator declares it dead within 30 s
        var clock = Stopwatch.StartNew();
        member.Kill();
        bool noticed = await WaitFor(() => coordinator.Members.Active.Count == 1, TimeSpan.FromSeconds(30));
        output.WriteLine($"dead worker noticed after {clock.Elapsed.TotalSeconds:F1} s");
        Assert.True(noticed, $"still {coordinator.Members.Active.Count} members after 30 s");
    }

    [Fact]
    public async Task Live_status_through_a_tls_gateway_needs_the_cluster_certificate()
    {
        // Given a coordinator that requires the cluster certificate
        using var workspace = new Workspace();
        using var certificate = ClusterCertificate.Create("test");
        var (pfx, port) = ExportAndPickPorts(workspace, certificate);
        await using var coordinator = await EmbeddedCluster.StartAsync(
            new ClusterRole { SiloPort = port, GatewayPort = port + 1, Certificate = certificate }, slots: 0, threads: null, new FoldwiseTelemetryOptions(), NoEvents.Instance, CancellationToken.None);

        // When status asks its gateway with the certificate, and without it
        var trusted = CliHarness.Run("status", $"127.0.0.1:{port + 1}", "--cert", pfx, "--passphrase", "test-passphrase");
        var untrusted = CliHarness.Run("status", $"127.0.0.1:{port + 1}");

        // Then only the client holding the certificate gets an answer
        Assert.True(trusted.ExitCode == 0, trusted.Output);
        Assert.Contains("runs no search now", trusted.Output);
        Assert.NotEqual(0, untrusted.ExitCode);
        Assert.Contains("no coordinator answered", untrusted.Output);
    }

    /// <summary>The certificate as the file a user copies to each machine (passphrase "test-passphrase"), and a free silo/gateway port pair.</summary>
    private static (string Pfx, int Port) ExportAndPickPorts(Workspace workspace, System.Security.Cryptography.X509Certificates.X509Certificate2 certificate)
    {
        string pfx = workspace.PathOf("cluster.pfx");
        ClusterCertificate.Export(certificate, pfx, "test-passphrase");
        return (pfx, MachineDefinition.FreePortPair());
    }

    private static async Task<bool> WaitFor(Func<bool> condition, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (condition())
            {
                return true;
            }

            await Task.Delay(100);
        }

        return condition();
    }
}
