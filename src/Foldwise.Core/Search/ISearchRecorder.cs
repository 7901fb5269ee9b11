namespace Foldwise.Core.Search;

/// <summary>
/// The coordinator's side of the store: trial records (as a journal), the prediction vectors of a finished
/// attempt, and the wall-clock time spent. Every call is durable when it returns.
/// </summary>
public interface ISearchRecorder : ITrialJournal
{
    void SaveVectors(int trialId, double[] outOfFold, double[] test);

    void UpdateSpent(double spentSeconds, bool finished);
}
