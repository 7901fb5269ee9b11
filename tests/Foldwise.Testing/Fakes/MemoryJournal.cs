using Foldwise.Core.Search;

namespace Foldwise.Testing.Fakes;

/// <summary>A journal that keeps every saved record in order, and can be told to fail, for coordinator tests.</summary>
public sealed class MemoryJournal : ITrialJournal
{
    private readonly List<TrialRecord> saved = [];

    public IReadOnlyList<TrialRecord> Saved => saved;

    public bool FailNextSave { get; set; }

    /// <summary>The last saved version of each trial, by id.</summary>
    public IReadOnlyList<TrialRecord> Latest() => [.. saved.GroupBy(t => t.Id).Select(g => g.Last()).OrderBy(t => t.Id)];

    public void Save(TrialRecord trial)
    {
        if (FailNextSave)
        {
            FailNextSave = false;
            throw new IOException("disk full (test)");
        }

        saved.Add(trial);
    }
}
