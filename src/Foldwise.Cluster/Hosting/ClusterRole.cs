using System.Net;
using System.Security.Cryptography.X509Certificates;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// Where a silo stands in the cluster and how it is reached. Defaults: the coordinator, free loopback ports,
/// no TLS (a cluster of one on one machine).
/// </summary>
public sealed class ClusterRole
{
    /// <summary>True for the silo that owns the search and the store (the primary silo).</summary>
    public bool IsCoordinator { get; init; } = true;

    /// <summary>The silo-to-silo port. <c>0</c> picks a free one (the embedded default).</summary>
    public int SiloPort { get; init; }

    /// <summary>The port clients (e.g. <c>status</c>) use. <c>0</c> picks a free one.</summary>
    public int GatewayPort { get; init; }

    /// <summary>For a worker: the coordinator's silo endpoint to join.</summary>
    public IPEndPoint? Join { get; init; }

    /// <summary>The address other machines reach this silo on. The default is loopback (one machine).</summary>
    public IPAddress Advertise { get; init; } = IPAddress.Loopback;

    /// <summary>Shared by every silo of one Foldwise cluster.</summary>
    public string ClusterId { get; init; } = "foldwise";

    /// <summary>How this silo is named in membership lines ("joined: 10.0.0.7:11111 (office-pc-3)"). Null keeps Orleans' generated name.</summary>
    public string? SiloName { get; init; }

    /// <summary>The cluster certificate; when set, silos talk only over mutual TLS with peers holding it.</summary>
    public X509Certificate2? Certificate { get; init; }

    /// <summary>Log information messages too, not only warnings and errors. The default is <c>false</c>.</summary>
    public bool Verbose { get; init; }
}
