using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Foldwise.Learners;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;

namespace Foldwise.Tuning;

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

    /// <summary>Starts the silo; a networked one reports where it listens and, as they happen, silos joining and leaving.</summary>
    public static Task<EmbeddedCluster> StartAsync(ClusterRole role, int slots, int? threads, FoldwiseTelemetryOptions telemetry, IProgress<SearchEvent> events, CancellationToken cancellation) =>
        StartAsync(role, slots, threads, LearnerCatalog.BuiltIn, telemetry, events, cancellation);

    /// <summary>As above, with the local slots training the families of <paramref name="learners"/>.</summary>
    internal static async Task<EmbeddedCluster> StartAsync(ClusterRole role, int slots, int? threads, ILearnerCatalog learners, FoldwiseTelemetryOptions telemetry, IProgress<SearchEvent> events, CancellationToken cancellation)
    {
        var builder = Host.CreateApplicationBuilder([]);
        ConsoleLogging.Configure(builder.Logging, role.Verbose);

        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = TimeSpan.FromSeconds(15));
        builder.UseOrleans(silo => silo.UseFoldwiseClustering(role));
        builder.Services.AddFoldwiseCoordinator();
        builder.Services.AddFoldwiseTelemetry(telemetry);
        if (slots > 0)
        {
            builder.Services.AddFoldwiseWorker(
                new WorkerOptions { Name = Environment.MachineName + "-coordinator", Slots = slots, ThreadsPerSlot = threads },
                learners,
                events);
        }

        var host = builder.Build();
        await host.StartAsync(cancellation);
        if (role.SiloPort != 0)
        {
            events.Report(new CoordinatorListening(role.Advertise.ToString(), role.SiloPort, role.Certificate is not null));
            host.Services.GetRequiredService<ClusterMembers>().Changed += change => events.Report(new ClusterChanged(change));
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
