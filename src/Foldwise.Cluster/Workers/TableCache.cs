using System.Collections.Concurrent;
using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;
using Foldwise.Core.Data;
using Foldwise.Core.Events;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// Tables by content hash: in memory, then on local disk, then fetched from the coordinator chunk by chunk
/// straight into the disk cache (<see cref="TableDownload"/>). Every fetched or cached file is checked against
/// its hash before it is decoded, and decoded from the file, never held as one array of bytes. The folder is its
/// owner's only and kept under <see cref="WorkerOptions.CacheLimitBytes"/> (see <see cref="CacheFolder"/>). A fetch
/// that lasts more than a moment reports its progress to <paramref name="events"/>.
/// </summary>
public sealed class TableCache(IGrainFactory grains, WorkerOptions options, IProgress<SearchEvent>? events = null)
{
    private readonly ConcurrentDictionary<string, Lazy<Task<FeatureTable>>> tables = new();

    /// <summary>Tables fetched over the network since start (a later search on the same table fetches nothing).</summary>
    public int Fetches { get; private set; }

    /// <summary>The tables held in memory, by hash (a test reads it).</summary>
    internal ICollection<string> Held => tables.Keys;

    /// <summary>Lets every table but these go from memory; they stay in the disk cache.</summary>
    public void HoldOnly(params string[] hashes)
    {
        foreach (string hash in tables.Keys.Where(h => !hashes.Contains(h)))
        {
            tables.TryRemove(hash, out _);
        }
    }

    /// <summary>Puts a table the process already holds (the coordinator's own slots never fetch).</summary>
    public void Seed(string hash, FeatureTable table) =>
        tables[hash] = new Lazy<Task<FeatureTable>>(Task.FromResult(table));

    public Task<FeatureTable> GetAsync(string hash, CancellationToken cancellation)
    {
        var entry = tables.GetOrAdd(hash, h => new Lazy<Task<FeatureTable>>(() => LoadAsync(h, CancellationToken.None)));
        if (entry.Value.IsFaulted || entry.Value.IsCanceled)
        {
            // A failed fetch is not remembered: the next trial fetches again.
            tables.TryRemove(new KeyValuePair<string, Lazy<Task<FeatureTable>>>(hash, entry));
        }

        // The shared load is not cancelled by one caller; each caller stops waiting on its own token.
        return entry.Value.WaitAsync(cancellation);
    }

    private async Task<FeatureTable> LoadAsync(string hash, CancellationToken cancellation)
    {
        string path = Path.Combine(options.CacheDirectory, hash + CacheFolder.Extension);
        if (File.Exists(path))
        {
            if (await HashOfFileAsync(path, cancellation) == hash)
            {
                CacheFolder.Touch(path);
                return Decode(path);
            }

            File.Delete(path);
        }

        CacheFolder.Ensure(options.CacheDirectory);
        string partial = path + "." + Environment.ProcessId + ".part";
        try
        {
            var dataset = grains.GetGrain<IDatasetGrain>(hash);
            var listing = await dataset.ListingAsync();
            var pacer = ProgressPacer.For(PreparationStep.Fetching, "table " + hash[..Math.Min(12, hash.Length)], events ?? NoEvents.Instance);
            await TableDownload.ToFileAsync(hash, listing, dataset.ChunkAsync, partial, cancellation, pacer.Tick);
            File.Move(partial, path, overwrite: true);
        }
        finally
        {
            File.Delete(partial);
        }

        Fetches++;
        CacheFolder.Prune(options.CacheDirectory, Math.Max(options.CacheLimitBytes, new FileInfo(path).Length));
        return Decode(path);
    }

    private static FeatureTable Decode(string path)
    {
        using var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1 << 16);
        return TableCodec.Decode(file, path);
    }

    private static async Task<string> HashOfFileAsync(string path, CancellationToken cancellation)
    {
        await using var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1 << 16);
        return Convert.ToHexStringLower(await SHA256.HashDataAsync(file, cancellation));
    }
}
