using System.Collections.Concurrent;
using Foldwise.Core.Search;

namespace Foldwise.Testing.Fakes;

/// <summary>An in-memory store for the coordinator side: trial records, vectors and time spent.</summary>
public sealed class MemoryRecorder : ISearchRecorder
{
    private readonly object gate = new();
    private readonly List<TrialRecord> saved = [];

    public ConcurrentDictionary<int, (double[] OutOfFold, double[] Test)> Vectors { get; } = new();

    public double SpentSeconds { get; private set; }

    public IReadOnlyList<TrialRecord> Latest()
    {
        lock (gate)
        {
            return [.. saved.GroupBy(t => t.Id).Select(g => g.Last()).OrderBy(t => t.Id)];
        }
    }

    public void Save(TrialRecord trial)
    {
        lock (gate)
        {
            saved.Add(trial);
        }
    }

    /// <summary>When set, the store holds this many trials' vectors and then fails every write, as a full disk does.</summary>
    public int? FullAfter { get; set; }

    public void SaveVectors(int trialId, double[] outOfFold, double[] test)
    {
        if (Vectors.Count >= FullAfter)
        {
            throw new IOException("No space left on device");
        }

        Vectors[trialId] = (outOfFold, test);
    }

    public void UpdateSpent(double spentSeconds, bool finished) => SpentSeconds = spentSeconds;
}
