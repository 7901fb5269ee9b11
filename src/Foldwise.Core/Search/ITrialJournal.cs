namespace Foldwise.Core.Search;

/// <summary>
/// Where the coordinator commits trial records. A call returns only once the record is durable,
/// so nothing acknowledged is lost if the process dies right after.
/// </summary>
public interface ITrialJournal
{
    void Save(TrialRecord trial);
}
