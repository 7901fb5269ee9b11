using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// The fold models of trials screened on the plan's first folds (racing over folds), kept in a worker's memory after
/// the trial reported, so that a promotion of the same candidate to every fold continues them instead of training
/// those folds again. Only a family that trains round by round is kept: it is continued round by round, exactly as if
/// it had never stopped, and the held-out predictions of the rounds it already trained are replayed from what the
/// screen recorded (a promotion may stop at another round than its screen). A worker keeps the most recently
/// screened trials up to <see cref="CapacityBytes"/> and <see cref="CapacityTrials"/>; a promotion that finds nothing
/// (another worker screened it, or it was dropped) trains every fold as before, with the same result. A worker keeps
/// the screens of one search at a time (the one it screened last).
/// </summary>
public sealed class ScreenedFits : IDisposable
{
    private readonly object sync = new();
    private readonly LinkedList<Entry> recent = [];

    /// <summary>Memory the kept trials may take, by <see cref="Estimate"/>.</summary>
    public long CapacityBytes { get; init; } = 256L << 20;

    /// <summary>Most trials kept at once.</summary>
    public int CapacityTrials { get; init; } = 64;

    /// <summary>Trials kept now.</summary>
    public int Count
    {
        get
        {
            lock (sync)
            {
                return recent.Count;
            }
        }
    }

    /// <summary>
    /// What one kept fold takes, generously: its recorded held-out predictions (8 bytes a row and round) and 32 bytes
    /// per training and held-out row for the model's own buffers (scores, gradients, the bag).
    /// </summary>
    public static long Estimate(ScreenedFold fold)
    {
        ArgumentNullException.ThrowIfNull(fold);
        return (8L * fold.Job.ValidationRows.Length * fold.HeldOutByRound.Count) + (32L * (fold.Job.TrainRows.Length + fold.Job.ValidationRows.Length));
    }

    /// <summary>Keeps <paramref name="folds"/> (the screen's folds in order) under <paramref name="trialId"/>; this takes them over and disposes them when dropped.</summary>
    internal void Keep(int trialId, FitKey key, IReadOnlyList<ScreenedFold> folds)
    {
        var entry = new Entry(trialId, key, folds, folds.Sum(Estimate));
        var dropped = new List<Entry>();
        lock (sync)
        {
            // Another search's screens go: their models hold that search's table, and its promotions come no more here.
            foreach (var other in recent.Where(e => !ReferenceEquals(e.Key.Data, key.Data)).ToList())
            {
                recent.Remove(other);
                dropped.Add(other);
            }

            recent.AddFirst(entry);
            while (recent.Count > 0 && (recent.Count > CapacityTrials || recent.Sum(e => e.Bytes) > CapacityBytes))
            {
                dropped.Add(recent.Last!.Value);
                recent.RemoveLast();
            }
        }

        foreach (var old in dropped)
        {
            old.Dispose();
        }
    }

    /// <summary>
    /// The folds kept for <paramref name="trialId"/>, handed over (the caller disposes them), when they were fitted
    /// exactly as <paramref name="key"/> would fit them; null otherwise (a kept entry that does not match is dropped).
    /// </summary>
    internal IReadOnlyList<ScreenedFold>? Take(int trialId, FitKey key)
    {
        Entry? found;
        lock (sync)
        {
            found = recent.FirstOrDefault(e => e.TrialId == trialId && ReferenceEquals(e.Key.Data, key.Data));
            if (found is not null)
            {
                recent.Remove(found);
            }
        }

        if (found is null)
        {
            return null;
        }

        if (found.Key == key)
        {
            return found.Folds;
        }

        found.Dispose();
        return null;
    }

    public void Dispose()
    {
        List<Entry> all;
        lock (sync)
        {
            all = [.. recent];
            recent.Clear();
        }

        foreach (var entry in all)
        {
            entry.Dispose();
        }
    }

    /// <summary>Everything that makes two fits of a fold the same fit: the table, the family, the parameters, the budget, the seed and the threads.</summary>
    internal sealed record FitKey(TrialData Data, string Family, ParameterSet Parameters, int Budget, int Seed, int Threads)
    {
        public bool Equals(FitKey? other) =>
            other is not null && ReferenceEquals(Data, other.Data) && Family == other.Family && Parameters.Equals(other.Parameters)
            && Budget == other.Budget && Seed == other.Seed && Threads == other.Threads;

        public override int GetHashCode() => HashCode.Combine(System.Runtime.CompilerServices.RuntimeHelpers.GetHashCode(Data), Family, Budget, Seed, Threads);
    }

    private sealed record Entry(int TrialId, FitKey Key, IReadOnlyList<ScreenedFold> Folds, long Bytes) : IDisposable
    {
        public void Dispose()
        {
            foreach (var fold in Folds)
            {
                fold.Fit.Dispose();
            }
        }
    }
}
