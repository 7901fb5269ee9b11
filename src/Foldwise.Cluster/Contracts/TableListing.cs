namespace Foldwise.Cluster.Contracts;

/// <summary>
/// What a worker needs to fetch a table in pieces and check each as it arrives: its length, the chunk size, and
/// the SHA-256 of every chunk in order (the whole table's hash is the grain's key).
/// </summary>
[GenerateSerializer, Immutable, Alias("Foldwise.TableListing")]
public sealed record TableListing(
    [property: Id(0)] long Length,
    [property: Id(1)] int ChunkSize,
    [property: Id(2)] string[] ChunkHashes);
