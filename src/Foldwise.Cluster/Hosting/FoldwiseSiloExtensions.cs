using System.Net;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Grains;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Learning;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Orleans.Configuration;

namespace Foldwise.Cluster.Hosting;

/// <summary>Registration of Foldwise's roles on an Orleans silo: one call per role, as Orleans' own providers do.</summary>
public static class FoldwiseSiloExtensions
{
    /// <summary>
    /// Clustering without a database: the coordinator is the primary silo and workers join it
    /// (Orleans' development clustering). Failure detection is set so a dead worker is noticed in about 20 s.
    /// </summary>
    public static ISiloBuilder UseFoldwiseClustering(this ISiloBuilder silo, ClusterRole role)
    {
        int siloPort = role.SiloPort == 0 ? FreePort.Find() : role.SiloPort;
        int gatewayPort = role.GatewayPort == 0 ? FreePort.Find() : role.GatewayPort;
        var primary = role.IsCoordinator ? new IPEndPoint(role.Advertise, siloPort) : role.Join
            ?? throw new ArgumentException("a worker needs the coordinator's endpoint to join", nameof(role));
        silo.UseDevelopmentClustering(primary);
        silo.ConfigureEndpoints(role.Advertise, siloPort, gatewayPort, listenOnAnyHostAddress: !IPAddress.IsLoopback(role.Advertise));
        silo.Configure<ClusterOptions>(o =>
        {
            o.ClusterId = role.ClusterId;
            o.ServiceId = role.ClusterId;
        });
        silo.Configure<ClusterMembershipOptions>(o =>
        {
            // Probes every 5 s, 2 missed votes: a silo that vanished is declared dead in ~15–25 s.
            o.ProbeTimeout = TimeSpan.FromSeconds(5);
            o.NumMissedProbesLimit = 2;
            o.NumVotesForDeathDeclaration = 1;
            o.TableRefreshTimeout = TimeSpan.FromSeconds(5);
            o.IAmAliveTablePublishTimeout = TimeSpan.FromSeconds(10);
        });
        silo.Configure<SiloMessagingOptions>(o => o.ResponseTimeout = TimeSpan.FromSeconds(60));
        return silo;
    }

    /// <summary>The coordinator role: the registry of running searches, the table shelf, and the ticker.</summary>
    public static IServiceCollection AddFoldwiseCoordinator(this IServiceCollection services)
    {
        services.TryAddSingleton(TimeProvider.System);
        services.AddSingleton<SessionRegistry>();
        services.AddSingleton<DatasetShelf>();
        services.AddHostedService<SessionTicker>();
        return services;
    }

    /// <summary>The worker role: slots that pull leases, with a table cache and the built-in families.</summary>
    public static IServiceCollection AddFoldwiseWorker(this IServiceCollection services, WorkerOptions options, ILearnerCatalog learners)
    {
        options.Validate();
        services.TryAddSingleton(TimeProvider.System);
        services.AddSingleton(options);
        services.AddSingleton(learners);
        services.AddSingleton<TableCache>();
        services.AddSingleton<TrialDataCache>();
        services.AddSingleton<SlotStatistics>();
        services.AddHostedService<SlotPump>();
        return services;
    }

    /// <summary>A worker silo must never host the coordinator's grains: they need its session and store.</summary>
    public static IServiceCollection ExcludeCoordinatorGrains(this IServiceCollection services) =>
        services.PostConfigure<GrainTypeOptions>(o =>
        {
            o.Classes.Remove(typeof(SearchGrain));
            o.Classes.Remove(typeof(DatasetGrain));
            o.Classes.Remove(typeof(SearchBoardGrain));
        });
}
