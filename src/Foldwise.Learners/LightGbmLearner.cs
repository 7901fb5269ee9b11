using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

namespace Foldwise.Learners;

/// <summary>
/// LightGBM regression through LightGBM's own C API, budget = boosting rounds. Deterministic for a seed; row
/// subsampling every round when row_fraction &lt; 1. Fits share no lock, so one process runs one fit per slot at once;
/// every fit of a process should use the same thread count (LightGBM keeps it in a process-wide setting).
/// <see cref="LightGbmFoldModel"/> offers what a fit alone does not: per-round held-out scores and continued training.
/// </summary>
public sealed class LightGbmLearner : IFoldLearner, IKeepsModels
{
    public string Family => FamilyNames.LightGbm;

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        using var model = LightGbmFoldModel.Train(job, scoreEachRound: false, cancellation);
        return model.Predict();
    }

    /// <summary>As <see cref="Fit"/>, with the model's text (LightGBM's own model format) as the kept bytes.</summary>
    public KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation)
    {
        using var model = LightGbmFoldModel.Train(job, scoreEachRound: false, cancellation);
        return new KeptFold(model.Predict(), model.Save());
    }

    public double[] PredictKept(FoldJob job, byte[] model) => LightGbmFoldModel.PredictKept(job, model);
}
