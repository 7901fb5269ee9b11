namespace Foldwise.Tuning;

/// <summary>
/// Where the scoring stage's threads spent their time, summed over threads: encoding the folds' inputs and predicting
/// with the fold models; with <see cref="Threads"/> threads busy the two add up to about that many times the stage's wall time.
/// </summary>
public sealed record KeptScoringWork(TimeSpan Encode, TimeSpan Predict, int Threads, int Folds, int Members);
