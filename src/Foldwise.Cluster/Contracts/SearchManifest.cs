namespace Foldwise.Cluster.Contracts;

/// <summary>
/// What a worker needs once per search: the two tables' hashes, the fold plan, the metric and the families that read
/// few-level category columns as level codes (LightGBM's own category splits) instead of indicator columns.
/// </summary>
[GenerateSerializer, Immutable, Alias("Foldwise.SearchManifest")]
public sealed record SearchManifest(
    [property: Id(0)] string SearchId,
    [property: Id(1)] string TrainHash,
    [property: Id(2)] string TestHash,
    [property: Id(3)] int FoldCount,
    [property: Id(4)] int FoldSeed,
    [property: Id(5)] int[] FoldOfRow,
    [property: Id(6)] string Metric,
    [property: Id(7)] string[] LevelCodeFamilies);
