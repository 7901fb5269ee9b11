using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Learners;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;

namespace Foldwise.Cli.Running;

/// <summary>
/// The coordinator's silo with its local slots: a cluster of one unless workers join. Trials run through the
/// same grains here as across machines.
/// </summary>
public sealed class EmbeddedCluster : IAsyncDisposable
{
    private readonly IHost host;

    private EmbeddedCluster(IHost host) => this.host = host;

    public SessionRegistry Sessions => host.Services.GetRequiredService<SessionRegistry>();

    public DatasetShelf Shelf => host.Services.GetRequiredService<DatasetShelf>();

    /// <summary>The silos this coordinator sees as active (itself included).</summary>
    public ClusterMembers Members => host.Services.GetRequiredService<ClusterMembers>();

    public TableCache? LocalTables => host.Services.GetService<TableCache>();

    public static async Task<EmbeddedCluster> StartAsync(ClusterRole role, int slots, int? threads, CancellationToken cancellation)
    {
        var builder = Host.CreateApplicationBuilder([]);
        ConsoleLogging.Configure(builder.Logging, role.Verbose);

        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = TimeSpan.FromSeconds(15));
        builder.UseOrleans(silo => silo.UseFoldwiseClustering(role));
        builder.Services.AddFoldwiseCoordinator();
        builder.Services.AddFoldwiseTelemetry(FoldwiseTelemetryOptions.FromEnvironment());
        if (slots > 0)
        {
            builder.Services.AddFoldwiseWorker(
                new WorkerOptions { Name = Environment.MachineName + "-coordinator", Slots = slots, ThreadsPerSlot = threads },
                LearnerCatalog.BuiltIn);
        }

        var host = builder.Build();
        await host.StartAsync(cancellation);
        if (role.SiloPort != 0)
        {
            // Networked: say how to join, and who comes and goes (one plain line each).
            if (OpenCluster.Warning(role.Advertise, role.Certificate is not null) is { } risk)
            {
                Console.Out.WriteLine(risk);
            }

            Console.Out.WriteLine($"Coordinator listening on {role.Advertise}:{role.SiloPort}" +
                                  (role.Certificate is null ? " (no certificate)" : " (mutual TLS)") +
                                  $"; workers join with: foldwise worker --join {role.Advertise}:{role.SiloPort}" + (role.Certificate is null ? "" : " --cert FILE"));
            host.Services.GetRequiredService<ClusterMembers>().Changed += line => Console.Out.WriteLine($"cluster {line}");
        }

        return new EmbeddedCluster(host);
    }

    public async ValueTask DisposeAsync()
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        try
        {
            await host.StopAsync(timeout.Token);
        }
        finally
        {
            host.Dispose();
        }
    }
}
