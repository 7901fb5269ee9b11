using Foldwise.Core.Learning;

namespace Foldwise.Learners.Native;

/// <summary>
/// The binned training and held-out rows of each fold, built once and lent to every trial of that fold with the
/// same Dataset settings (<see cref="LightGbmParameters.ForDataset"/>: the bins and the smallest leaf, so a
/// promotion always reuses its rung's rows). A trial that reuses them trains exactly as on rows binned afresh
/// (<c>FoldDatasetTests</c>).
/// A job whose rows or inputs are not its plan's fold's own gets Datasets of its own. The most recently used folds
/// are kept up to about <see cref="CapacityBytes"/>; a lent Dataset lives until its last borrower is disposed.
/// </summary>
internal static class FoldDatasets
{
    /// <summary>
    /// Memory the kept folds may take, by <see cref="Estimate"/>: on the full-size demo a fold took about 12 MB (the
    /// process's working set grew by 60 MB per five folds) and is estimated at about 24 MB (1.24 million stored cells,
    /// 6,914 columns), so this keeps the folds of its last four or so candidates.
    /// </summary>
    public static long CapacityBytes { get; set; } = 512L << 20;

    private static readonly object Sync = new();
    private static readonly LinkedList<Entry> Recent = [];

    private static int built;

    /// <summary>How many fold Datasets were binned since the process started (a test reads it to see reuse).</summary>
    public static int Built => Volatile.Read(ref built);

    /// <summary>The fold's training and held-out Datasets, borrowed: dispose both when done.</summary>
    public static (LightGbmDataset Train, LightGbmDataset Validation) Borrow(FoldJob job, NativeFoldRows inputs)
    {
        string parameters = LightGbmParameters.ForDataset(job);
        if (!IsPlanFold(job))
        {
            return Bin(job, inputs, parameters);
        }

        var key = new Key(job.Data, job.Fold, job.Inputs is null, job.Features.ColumnCount, LightGbmParameters.ForDataset(job, withThreads: false));
        Entry entry;
        lock (Sync)
        {
            entry = Recent.FirstOrDefault(e => e.Key == key) ?? new Entry(key);
            Recent.Remove(entry);
            Recent.AddFirst(entry);
            entry.Users++;
        }

        try
        {
            var (train, validation) = entry.Binned(() => Bin(job, inputs, parameters), () => MakeRoom(entry, Estimate(inputs)));
            return (train.Borrow(), validation.Borrow());
        }
        catch
        {
            lock (Sync)
            {
                Recent.Remove(entry);
                entry.Evicted = true;
            }

            throw;
        }
        finally
        {
            lock (Sync)
            {
                entry.Users--;
                entry.DisposeIfUnused();
                Evict(keep: 1, room: 0);
            }
        }
    }

    /// <summary>
    /// Drops the least recently used other folds before <paramref name="entry"/> is binned, so the kept folds and the new
    /// one stay within <see cref="CapacityBytes"/> together: a fold dropped only after the new one was binned would still
    /// hold its memory while the new rows are binned (a dropped fold a trial still trains on lives until it ends).
    /// </summary>
    /// <returns><paramref name="bytes"/>, the new fold's estimate.</returns>
    private static long MakeRoom(Entry entry, long bytes)
    {
        lock (Sync)
        {
            // An entry another borrower dropped meanwhile stays out: it is freed when its last borrower is done.
            bool kept = Recent.Remove(entry);
            Evict(keep: 0, room: bytes);
            if (kept)
            {
                Recent.AddFirst(entry);
            }

            return bytes;
        }
    }

    /// <summary>Drops the least recently used folds while the kept ones and <paramref name="room"/> exceed the capacity, keeping at least <paramref name="keep"/>.</summary>
    private static void Evict(int keep, long room)
    {
        while (Recent.Count > keep && Recent.Sum(e => e.Bytes) + room > CapacityBytes && Recent.Last!.Value is var oldest)
        {
            Recent.RemoveLast();
            oldest.Evicted = true;
            oldest.DisposeIfUnused();
        }
    }

    /// <summary>True when the job trains on its plan's fold exactly as every trial of that fold does.</summary>
    private static bool IsPlanFold(FoldJob job)
    {
        var folds = job.Data.Folds;
        bool ownInputs = job.Inputs is null || job.Inputs.PlanFold == job.Fold;
        return ownInputs && job.Fold < folds.FoldCount && job.TrainRows.AsSpan().SequenceEqual(folds.TrainRows(job.Fold).AsSpan()) && job.ValidationRows.AsSpan().SequenceEqual(folds.ValidationRows(job.Fold).AsSpan());
    }

    /// <summary>What a fold's Datasets take, generously: 8 bytes a stored cell and 2 kB a column (its bin bounds).</summary>
    public static long Estimate(NativeFoldRows inputs)
    {
        var (train, validation) = inputs.Cells();
        return (8L * (train + validation)) + (2048L * inputs.Job.Features.ColumnCount);
    }

    /// <summary>Bins the fold's training rows, then its held-out rows like them; each copy of the rows is freed as soon as LightGBM has binned it.</summary>
    private static (LightGbmDataset Train, LightGbmDataset Validation) Bin(FoldJob job, NativeFoldRows inputs, string parameters)
    {
        Interlocked.Increment(ref built);
        LightGbmDataset train;
        using (var rows = inputs.CopyTrain())
        {
            train = LightGbmDataset.FromRows(rows, inputs.Labels(), parameters, reference: null, $"the training rows of fold {job.Fold}");
        }

        try
        {
            using var rows = inputs.CopyValidation();
            return (train, LightGbmDataset.FromRows(rows, labels: null, parameters, train, $"the held-out rows of fold {job.Fold}"));
        }
        catch
        {
            train.Dispose();
            throw;
        }
    }

    /// <param name="Plain">The table's own features (a job without encoded inputs) rather than the fold's encoded ones.</param>
    /// <param name="Columns">The inputs' columns: few-level category columns as indicators or as level codes differ in them.</param>
    private sealed record Key(TrialData Data, int Fold, bool Plain, int Columns, string Parameters)
    {
        public bool Equals(Key? other) =>
            other is not null && ReferenceEquals(Data, other.Data) && Fold == other.Fold && Plain == other.Plain && Columns == other.Columns && Parameters == other.Parameters;

        public override int GetHashCode() => HashCode.Combine(System.Runtime.CompilerServices.RuntimeHelpers.GetHashCode(Data), Fold, Plain, Columns, Parameters);
    }

    private sealed class Entry(Key key)
    {
        private readonly object building = new();
        private (LightGbmDataset Train, LightGbmDataset Validation)? binned;

        public Key Key { get; } = key;

        /// <summary>Borrowers between lookup and borrowing: an evicted entry is freed only when none is left.</summary>
        public int Users { get; set; }

        public bool Evicted { get; set; }

        /// <summary>The Datasets' <see cref="Estimate"/> once binned, else 0.</summary>
        public long Bytes { get; private set; }

        /// <param name="beforeBinning">Told once, before this entry's rows are binned, with the lock of the kept folds not held.</param>
        public (LightGbmDataset Train, LightGbmDataset Validation) Binned(Func<(LightGbmDataset, LightGbmDataset)> bin, Func<long> beforeBinning)
        {
            lock (building)
            {
                if (binned is null)
                {
                    long bytes = beforeBinning();
                    binned = bin();
                    Bytes = bytes;
                }

                return binned.Value;
            }
        }

        public void DisposeIfUnused()
        {
            if (Evicted && Users == 0 && binned is var (train, validation))
            {
                validation.Dispose();
                train.Dispose();
                binned = null;
            }
        }
    }
}
