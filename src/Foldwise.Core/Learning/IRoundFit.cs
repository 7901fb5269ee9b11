namespace Foldwise.Core.Learning;

/// <summary>
/// One fold's model trained one round at a time, so that a trial can watch its held-out score round by round and
/// keep the best round count (<see cref="RoundStopping"/>). Disposing it frees the model.
/// </summary>
public interface IRoundFit : IDisposable
{
    /// <summary>Rounds trained so far.</summary>
    int Rounds { get; }

    /// <summary>Trains one more round; false when no leaf can be split any more (the model then stays as it was).</summary>
    bool TrainRound();

    /// <summary>The held-out rows' predictions after the rounds trained so far, on the fitting scale, in the job's order.</summary>
    double[] HeldOutPredictions();

    /// <summary>
    /// The same as <see cref="HeldOutPredictions()"/>, written into <paramref name="into"/> (one entry per held-out row):
    /// a trial asks after every round, and on a table of millions of rows a new vector each time is garbage the size
    /// of the held-out rows, per fold and round.
    /// </summary>
    void HeldOutPredictions(Span<double> into) => HeldOutPredictions().CopyTo(into);

    /// <summary>
    /// Predictions from the first <paramref name="rounds"/> rounds (1..<see cref="Rounds"/>; 0 only when no round was
    /// trained): the held-out rows, and the test table when <paramref name="withTest"/> (else an empty test vector).
    /// </summary>
    FoldPrediction Predict(int rounds, bool withTest);
}
