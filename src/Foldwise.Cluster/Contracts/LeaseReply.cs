namespace Foldwise.Cluster.Contracts;

/// <summary>
/// A leased trial as a slot needs it: a family name and parameter values (never code), a budget, a seed, how often to
/// renew, the search's trace context (W3C <c>traceparent</c>, null when the coordinator traces nothing), and whether
/// the test table is to be predicted (only trials the blend may weight need it), and how many of the plan's first folds
/// it trains (0: all; see <see cref="Core.Search.TrialRecord.Folds"/>).
/// </summary>
[GenerateSerializer, Immutable, Alias("Foldwise.LeaseReply")]
public sealed record LeaseReply(
    [property: Id(0)] LeaseStatus Status,
    [property: Id(1)] int TrialId,
    [property: Id(2)] int Attempt,
    [property: Id(3)] string Family,
    [property: Id(4)] Dictionary<string, double> Parameters,
    [property: Id(5)] int Budget,
    [property: Id(6)] int Seed,
    [property: Id(7)] TimeSpan LeaseDuration,
    [property: Id(8)] string? TraceParent = null,
    [property: Id(9)] string? Reason = null,
    [property: Id(10)] bool PredictsTest = true,
    [property: Id(11)] int Folds = 0,
    [property: Id(12)] int? ParentId = null)
{
    public static LeaseReply Waiting { get; } = new(LeaseStatus.Wait, 0, 0, "", [], 0, 0, TimeSpan.Zero);

    public static LeaseReply Done { get; } = new(LeaseStatus.Finished, 0, 0, "", [], 0, 0, TimeSpan.Zero);
}
