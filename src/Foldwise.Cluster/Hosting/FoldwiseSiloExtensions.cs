using System.Net;
using System.Security.Cryptography.X509Certificates;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Grains;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Orleans.Configuration;
using Orleans.Connections.Security;

namespace Foldwise.Cluster.Hosting;

/// <summary>Registration of Foldwise's roles on an Orleans silo: one call per role, as Orleans' own providers do.</summary>
public static class FoldwiseSiloExtensions
{
    /// <summary>
    /// Clustering without a database: the coordinator is the primary silo and workers join it (Orleans'
    /// development clustering). Failure detection is set so a vanished silo is declared dead within ~20 s;
    /// with a cluster certificate every silo connection is mutual TLS.
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
        if (role.SiloName is { Length: > 0 } name)
        {
            silo.Configure<SiloOptions>(o => o.SiloName = name);
        }

        silo.Configure<ClusterMembershipOptions>(o =>
        {
            // Orleans 10 adapts each probe's timeout between MinProbeTimeout and MaxProbeTimeout (by default
            // ProbeTimeout/2 and 4 × ProbeTimeout), so the worst case to suspect a silo is
            // MaxProbeTimeout × NumMissedProbesLimit = 6 s × 3 = 18 s; one vote then declares it dead (in a
            // cluster of two nobody else could vote), and the table refresh spreads the news within 5 s.
            // Measured with SIGKILL on loopback: see the machines tests and the report.
            o.ProbeTimeout = TimeSpan.FromSeconds(3);
            o.MinProbeTimeout = TimeSpan.FromSeconds(1.5);
            o.MaxProbeTimeout = TimeSpan.FromSeconds(6);
            o.NumMissedProbesLimit = 3;
            o.NumVotesForDeathDeclaration = 1;
            o.TableRefreshTimeout = TimeSpan.FromSeconds(5);
            o.IAmAliveTablePublishTimeout = TimeSpan.FromSeconds(10);
            o.DeathVoteExpirationTimeout = TimeSpan.FromSeconds(30);
            // A worker that cannot reach the coordinator gives up joining after a minute and retries from scratch.
            o.MaxJoinAttemptTime = TimeSpan.FromSeconds(60);
        });
        silo.Configure<SiloMessagingOptions>(o => o.ResponseTimeout = TimeSpan.FromSeconds(60));
        if (role.Certificate is { } certificate)
        {
            silo.LogTlsRefusals();
            silo.UseFoldwiseTls(certificate);
        }

        silo.Services.AddSingleton<ClusterMembers>();
        silo.Services.AddHostedService<MembershipWatch>();
        return silo;
    }

    /// <summary>
    /// Mutual TLS on every silo connection: this silo shows the cluster certificate and accepts a peer only if
    /// the peer shows the same one (thumbprint compared). A self-signed certificate fails the platform's chain
    /// and name checks, which is why those errors are ignored in favour of the exact match.
    /// </summary>
    public static ISiloBuilder UseFoldwiseTls(this ISiloBuilder silo, X509Certificate2 certificate) =>
        silo.UseTls(certificate, o =>
        {
            o.RemoteCertificateMode = RemoteCertificateMode.RequireCertificate;
            o.ClientCertificateMode = RemoteCertificateMode.RequireCertificate;
            o.RemoteCertificateValidation = (presented, _, _) => TlsRefusals.Check(certificate, presented);
            o.OnAuthenticateAsClient = (_, ssl) => ssl.TargetHost = "foldwise";
            o.HandshakeTimeout = TimeSpan.FromSeconds(5);
        });

    /// <summary>The coordinator role: the registry of running searches, the table shelf, and the ticker.</summary>
    public static IServiceCollection AddFoldwiseCoordinator(this IServiceCollection services)
    {
        services.TryAddSingleton(TimeProvider.System);
        services.AddSingleton<SessionRegistry>();
        services.AddSingleton<DatasetShelf>();
        services.AddMetrics();
        services.TryAddSingleton<FoldwiseMetrics>();
        services.AddHostedService<SessionTicker>();
        return services;
    }

    /// <summary>
    /// The worker role: slots that pull leases, with a table cache and the built-in families. The slots report what
    /// they do to <paramref name="events"/> (default: nobody).
    /// </summary>
    public static IServiceCollection AddFoldwiseWorker(this IServiceCollection services, WorkerOptions options, ILearnerCatalog learners, IProgress<SearchEvent>? events = null)
    {
        options.Validate();
        services.TryAddSingleton(TimeProvider.System);
        services.AddSingleton(events ?? NoEvents.Instance);
        services.AddSingleton(options);
        services.AddSingleton(learners);
        services.AddSingleton<TableCache>();
        services.AddSingleton<TrialDataCache>();
        services.AddSingleton<SlotStatistics>();
        services.AddSingleton<WorkerStop>();
        services.AddMetrics();
        services.TryAddSingleton<FoldwiseMetrics>();
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
