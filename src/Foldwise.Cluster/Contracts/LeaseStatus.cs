namespace Foldwise.Cluster.Contracts;

/// <summary>The wire form of Core's lease kinds.</summary>
[GenerateSerializer, Alias("Foldwise.LeaseStatus")]
public enum LeaseStatus
{
    Granted,
    Wait,
    Finished,

    /// <summary>This worker's trials failed too often in a row while others succeeded; the reply's reason says why.</summary>
    Quarantined,
}
