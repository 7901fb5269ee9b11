namespace Foldwise.Cluster.Contracts;

/// <summary>What a worker tells the coordinator before its first lease: its name, its build, and the families it can train.</summary>
[GenerateSerializer, Immutable, Alias("Foldwise.WorkerHello")]
public sealed record WorkerHello(
    [property: Id(0)] string Worker,
    [property: Id(1)] string Version,
    [property: Id(2)] string[] Families);
