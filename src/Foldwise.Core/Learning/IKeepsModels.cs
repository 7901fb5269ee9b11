namespace Foldwise.Core.Learning;

/// <summary>
/// A family whose fold models can be kept and used again: a fit that also hands back its model as bytes, and a
/// prediction of a job's test rows from those bytes. Both prepare the job's inputs the same way (imputation, scaling
/// learnt from its training rows), so a kept model scores new rows exactly as the fit scored the test table.
/// </summary>
public interface IKeepsModels
{
    KeptFold FitAndKeep(FoldJob job, CancellationToken cancellation);

    /// <summary>Predictions of every row of the job's test table, on the fitting scale, from a model kept by <see cref="FitAndKeep"/>.</summary>
    double[] PredictKept(FoldJob job, byte[] model);
}
