namespace Foldwise.Cluster.Contracts;

/// <summary>The wire form of Core's lease kinds.</summary>
[GenerateSerializer, Alias("Foldwise.LeaseStatus")]
public enum LeaseStatus
{
    Granted,
    Wait,
    Finished,
}
