using System.Collections.Immutable;

namespace Foldwise.Core.Learning;

/// <summary>
/// A trial's result on the fitting scale: the score of its pooled out-of-fold predictions, each fold's
/// own score (their spread is the noise floor), the out-of-fold vector and the mean test prediction.
/// </summary>
public sealed record TrialOutcome(double Score, ImmutableArray<double> FoldScores, double[] OutOfFold, double[] Test);
