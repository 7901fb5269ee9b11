namespace Foldwise.Cluster.Contracts;

/// <summary>What a worker needs once per search: the two tables' hashes, the fold plan and the metric.</summary>
[GenerateSerializer, Immutable, Alias("Foldwise.SearchManifest")]
public sealed record SearchManifest(
    [property: Id(0)] string SearchId,
    [property: Id(1)] string TrainHash,
    [property: Id(2)] string TestHash,
    [property: Id(3)] int FoldCount,
    [property: Id(4)] int FoldSeed,
    [property: Id(5)] int[] FoldOfRow,
    [property: Id(6)] string Metric);
