namespace Foldwise.Core.Learning;

/// <summary>
/// Runs a family's fits through <see cref="IKeepsModels.FitAndKeep"/> and holds each fold's model, so a
/// <see cref="TrialExecutor"/> re-fits a trial exactly as a worker ran it and the models come with it.
/// </summary>
public sealed class KeepingLearner(IFoldLearner learner) : IFoldLearner
{
    private readonly IKeepsModels keeper = learner as IKeepsModels
        ?? throw new ArgumentException($"the {learner?.Family} family cannot keep its models", nameof(learner));

    private readonly SortedDictionary<int, byte[]> models = [];

    public string Family => learner.Family;

    /// <summary>The models fitted so far, by fold.</summary>
    public IReadOnlyList<byte[]> Models => [.. models.Values];

    public FoldPrediction Fit(FoldJob job, CancellationToken cancellation)
    {
        ArgumentNullException.ThrowIfNull(job);
        var kept = keeper.FitAndKeep(job, cancellation);
        models[job.Fold] = kept.Model;
        return kept.Prediction;
    }
}
