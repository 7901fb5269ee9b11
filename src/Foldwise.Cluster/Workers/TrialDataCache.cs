using System.Collections.Concurrent;
using Foldwise.Cluster.Contracts;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// Builds a search's <see cref="TrialData"/> once per worker (tables by hash, fold plan and metric from the manifest),
/// then lets the tables go from memory.
/// A worker works for one coordinator, which runs one search at a time, so only the latest search's data is held:
/// asking for a new search lets the earlier ones' data and tables go (a trial still running keeps what it holds; a
/// later trial of an earlier search builds its data again), so a long-lived worker's memory does not grow with every
/// search it served.
/// </summary>
public sealed class TrialDataCache(IGrainFactory grains, TableCache tables)
{
    private readonly ConcurrentDictionary<string, Lazy<Task<TrialData>>> searches = new();

    /// <summary>The searches whose data is held (a test reads it).</summary>
    internal ICollection<string> Held => searches.Keys;

    public Task<TrialData> GetAsync(string searchId, CancellationToken cancellation)
    {
        foreach (string earlier in searches.Keys.Where(id => id != searchId))
        {
            searches.TryRemove(earlier, out _);
        }

        var entry = searches.GetOrAdd(searchId, id => new Lazy<Task<TrialData>>(() => BuildAsync(id, CancellationToken.None)));
        if (entry.Value.IsFaulted || entry.Value.IsCanceled)
        {
            // A failed fetch is not cached: the next trial tries again.
            searches.TryRemove(new KeyValuePair<string, Lazy<Task<TrialData>>>(searchId, entry));
        }

        return entry.Value.WaitAsync(cancellation);
    }

    private async Task<TrialData> BuildAsync(string searchId, CancellationToken cancellation)
    {
        var manifest = await grains.GetGrain<ISearchGrain>(searchId).GetManifestAsync();
        var train = await tables.GetAsync(manifest.TrainHash, cancellation);
        var test = await tables.GetAsync(manifest.TestHash, cancellation);
        tables.HoldOnly(manifest.TrainHash, manifest.TestHash);
        var folds = new FoldPlan(manifest.FoldCount, manifest.FoldSeed, [.. manifest.FoldOfRow]);
        var metric = Metric.For(Enum.Parse<MetricKind>(manifest.Metric));
        var data = TrialData.From(train, test, folds, metric) with { LevelCodeFamilies = [.. manifest.LevelCodeFamilies] };
        LetTablesGo();
        return data;
    }

    /// <summary>
    /// Trials read only the rows form built from the tables, so the tables (columns, row ids) leave memory; they stay in
    /// the disk cache for a later search. One compacting collection then gives back to the system at once what decoding
    /// and transposing them left free: on a 1,000,000 x 40 table the process's resident memory fell from 0.50 to 0.17 GB
    /// with 0.13 GB of row data live (bench/Foldwise.Bench.FoldFit --memory --aggressive, 2026-12-05); without it the
    /// collector kept the free memory committed while the trials' native memory grew beside it.
    /// </summary>
    private void LetTablesGo()
    {
        tables.HoldOnly();
        GC.Collect(2, GCCollectionMode.Aggressive, blocking: true, compacting: true);
    }
}
