using Foldwise.Core.Learning;

namespace Foldwise.Testing.Fakes;

/// <summary>
/// A round-by-round learner whose every prediction after r rounds is the actual target (test rows: 0) plus
/// <c>error(r)</c>, so under RMSE the pooled held-out score after r rounds is |error(r)|. It records what was asked of it.
/// Another constructor gives each fold its own curve, <c>error(fold, r)</c>.
/// </summary>
public sealed class CurveLearner(Func<int, int, double> foldError, int splitsUntil = int.MaxValue) : IRoundLearner
{
    private readonly List<CurveFit> fits = [];

    public CurveLearner(Func<int, double> error, int splitsUntil = int.MaxValue)
        : this((_, rounds) => error(rounds), splitsUntil)
    {
    }

    public string Family => "curve";

    /// <summary>Every fold model started, in fold order.</summary>
    public IReadOnlyList<CurveFit> Fits => fits;

    /// <summary>Whole fits (the path without round-by-round training) asked for.</summary>
    public int WholeFits { get; private set; }

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        WholeFits++;
        using var fit = new CurveFit(job, rounds => foldError(job.Fold, rounds), splitsUntil);
        while (fit.Rounds < job.Budget && fit.TrainRound())
        {
        }

        return fit.Predict(fit.Rounds, job.PredictsTest);
    }

    public IRoundFit Start(FoldJob job, CancellationToken cancellation)
    {
        var fit = new CurveFit(job, rounds => foldError(job.Fold, rounds), splitsUntil);
        fits.Add(fit);
        return fit;
    }

    /// <summary>One fold of a <see cref="CurveLearner"/>.</summary>
    public sealed class CurveFit(FoldJob job, Func<int, double> error, int splitsUntil) : IRoundFit
    {
        public int Rounds { get; private set; }

        /// <summary>The round counts <see cref="Predict"/> was asked for, with whether the test table was wanted.</summary>
        public List<(int Rounds, bool WithTest)> Predictions { get; } = [];

        public bool Disposed { get; private set; }

        /// <summary>The fold this model was started for.</summary>
        public int Fold => job.Fold;

        public bool TrainRound()
        {
            if (Rounds >= splitsUntil)
            {
                return false;
            }

            Rounds++;
            return true;
        }

        public double[] HeldOutPredictions() => [.. job.ValidationRows.Select(r => job.Data.Target[r] + error(Rounds))];

        public FoldPrediction Predict(int rounds, bool withTest)
        {
            Predictions.Add((rounds, withTest));
            return new FoldPrediction(
                [.. job.ValidationRows.Select(r => job.Data.Target[r] + error(rounds))],
                withTest ? [.. Enumerable.Repeat(error(rounds), job.Data.Test.RowCount)] : []);
        }

        public void Dispose() => Disposed = true;
    }
}
