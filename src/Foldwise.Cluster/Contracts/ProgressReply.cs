namespace Foldwise.Cluster.Contracts;

/// <summary>A progress snapshot over the wire, for <c>status</c> and progress bars on other machines.</summary>
[GenerateSerializer, Immutable, Alias("Foldwise.ProgressReply")]
public sealed record ProgressReply(
    [property: Id(0)] int Created,
    [property: Id(1)] int Queued,
    [property: Id(2)] int Running,
    [property: Id(3)] int Done,
    [property: Id(4)] int Failed,
    [property: Id(5)] int? TrialBudget,
    [property: Id(6)] double SpentSeconds,
    [property: Id(7)] double? HoursBudget,
    [property: Id(8)] Dictionary<string, double> BestByFamily,
    [property: Id(9)] string? Stopping,
    [property: Id(10)] bool Finished,
    [property: Id(11)] string[] RunningOn,
    [property: Id(12)] Dictionary<string, string>? Quarantined = null);
