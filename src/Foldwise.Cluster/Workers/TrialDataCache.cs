using System.Collections.Concurrent;
using Foldwise.Cluster.Contracts;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;

namespace Foldwise.Cluster.Workers;

/// <summary>Builds each search's <see cref="TrialData"/> once per worker (tables by hash, fold plan and metric from the manifest).</summary>
public sealed class TrialDataCache(IGrainFactory grains, TableCache tables)
{
    private readonly ConcurrentDictionary<string, Lazy<Task<TrialData>>> searches = new();

    public Task<TrialData> GetAsync(string searchId, CancellationToken cancellation)
    {
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
        var folds = new FoldPlan(manifest.FoldCount, manifest.FoldSeed, [.. manifest.FoldOfRow]);
        var metric = Metric.For(Enum.Parse<MetricKind>(manifest.Metric));
        return TrialData.From(train, test, folds, metric) with { LevelCodeFamilies = [.. manifest.LevelCodeFamilies] };
    }
}
