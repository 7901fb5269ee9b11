namespace Foldwise.Cluster.Hosting;

/// <summary>Where a silo stands in the cluster and how it is reached.</summary>
public sealed class ClusterRole
{
    /// <summary>True for the silo that owns the search and the store (the primary silo).</summary>
    public bool IsCoordinator { get; init; } = true;

    /// <summary>The silo-to-silo port. <c>0</c> picks a free one (the embedded default).</summary>
    public int SiloPort { get; init; }

    /// <summary>The port clients (e.g. <c>status</c>) use. <c>0</c> picks a free one.</summary>
    public int GatewayPort { get; init; }

    /// <summary>For a worker: the coordinator's silo endpoint to join.</summary>
    public System.Net.IPEndPoint? Join { get; init; }

    /// <summary>The address other machines reach this silo on. The default is loopback (one machine).</summary>
    public System.Net.IPAddress Advertise { get; init; } = System.Net.IPAddress.Loopback;

    /// <summary>Shared by every silo of one Foldwise cluster.</summary>
    public string ClusterId { get; init; } = "foldwise";
}
