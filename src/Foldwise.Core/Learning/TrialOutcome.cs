using System.Collections.Immutable;

namespace Foldwise.Core.Learning;

/// <summary>
/// A trial's result on the fitting scale: the score of its pooled out-of-fold predictions, each fold's
/// own score (their spread is the noise floor), the out-of-fold vector and the mean test prediction (empty when the
/// test table was not predicted).
/// </summary>
/// <param name="BestRound">The round count kept when the trial trained round by round and stopped at its best (<see cref="RoundStopping"/>); null when it trained its whole budget.</param>
/// <param name="RoundsTrained">Rounds the trial's folds trained (its budget unless it stopped early): what it cost.</param>
public sealed record TrialOutcome(double Score, ImmutableArray<double> FoldScores, double[] OutOfFold, double[] Test, int? BestRound, int RoundsTrained)
{
    /// <summary>
    /// Fold-rounds (summed over folds) this trial took over from its screen's kept models instead of training them
    /// (<see cref="ScreenedFits"/>): its cost is <see cref="RoundsTrained"/> on each fold less these.
    /// </summary>
    public int RoundsContinued { get; init; }
}
