namespace Foldwise.Core.Learning;

/// <summary>A family that can train a fold one round at a time (LightGBM through its C API); the others fit whole.</summary>
public interface IRoundLearner : IFoldLearner
{
    /// <summary>Prepares the fold's model with no round trained yet.</summary>
    IRoundFit Start(FoldJob job, CancellationToken cancellation);
}
