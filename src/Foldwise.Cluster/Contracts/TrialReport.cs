namespace Foldwise.Cluster.Contracts;

/// <summary>
/// A slot's result for one attempt of a trial: scores and prediction vectors on the fitting scale (the test vector
/// empty when the lease did not ask for it), the round count the trial kept when it stopped at its best round, and
/// the rounds it took over from its screen's fold models instead of training them again.
/// </summary>
[GenerateSerializer, Immutable, Alias("Foldwise.TrialReport")]
public sealed record TrialReport(
    [property: Id(0)] int TrialId,
    [property: Id(1)] int Attempt,
    [property: Id(2)] string Worker,
    [property: Id(3)] string Slot,
    [property: Id(4)] double Score,
    [property: Id(5)] double[] FoldScores,
    [property: Id(6)] double[] OutOfFold,
    [property: Id(7)] double[] Test,
    [property: Id(8)] double Seconds,
    [property: Id(9)] int? BestRound = null,
    [property: Id(10)] int RoundsContinued = 0);
