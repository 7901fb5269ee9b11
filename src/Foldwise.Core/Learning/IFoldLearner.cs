namespace Foldwise.Core.Learning;

/// <summary>
/// A built-in learner family: fits one fold and predicts that fold's held-out rows and the whole
/// test table, on the fitting scale. Implementations are deterministic for a fixed seed.
/// </summary>
public interface IFoldLearner
{
    string Family { get; }

    FoldPrediction Fit(FoldJob job, CancellationToken cancellation);
}
