namespace Foldwise.Core.Learning;

/// <summary>
/// When a trial that trains round by round stops, and which round count it keeps. After every round the trial scores
/// its pooled held-out predictions (all folds at the same round count); the round with the lowest score is its best
/// round, ties to the earlier one. Training stops once that many rounds have passed without a better score
/// (<see cref="Patience"/>) or at the budget; the trial keeps its best round for its held-out and test predictions.
/// One round count for all folds, chosen on the pooled score, rather than one per fold: a fold's own best round is
/// chosen on the very rows it is then scored on, five times over.
/// </summary>
/// <param name="MinimumPatience">Rounds without improvement that always stop a trial, however small its budget.</param>
/// <param name="PatienceShare">The share of the budget after which rounds without improvement stop a trial.</param>
public sealed record RoundStopping(int MinimumPatience, double PatienceShare)
{
    /// <summary>
    /// Ten rounds, or a tenth of the budget when that is more: waiting about a tenth of the planned rounds for an
    /// improvement is common practice for gradient boosting; the floor of ten keeps a short rung from stopping on noise.
    /// </summary>
    public static RoundStopping Default { get; } = new(10, 0.1);

    /// <summary>Rounds without a better score after which a trial of <paramref name="budget"/> rounds stops.</summary>
    public int Patience(int budget)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(budget);
        return Math.Max(MinimumPatience, (int)Math.Ceiling(budget * PatienceShare));
    }

    /// <summary>True when a trial of <paramref name="budget"/> rounds, now at <paramref name="round"/>, best at <paramref name="bestRound"/>, trains no further.</summary>
    public bool Stops(int round, int bestRound, int budget) => round >= budget || round - bestRound >= Patience(budget);

    /// <summary>True when <paramref name="score"/> replaces <paramref name="best"/> as the best so far (lower is better; a tie keeps the earlier round).</summary>
    public static bool Improves(double score, double best) => score < best;
}
