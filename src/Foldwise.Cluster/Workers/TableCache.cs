using System.Collections.Concurrent;
using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;
using Foldwise.Core.Data;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// Tables by content hash: in memory, then on local disk, then fetched from the coordinator in chunks.
/// Every fetched or cached byte string is checked against its hash before it is decoded. The folder is its owner's
/// only and kept under <see cref="WorkerOptions.CacheLimitBytes"/> (see <see cref="CacheFolder"/>).
/// </summary>
public sealed class TableCache(IGrainFactory grains, WorkerOptions options)
{
    private const int ChunkSize = 4 << 20;
    private readonly ConcurrentDictionary<string, Lazy<Task<FeatureTable>>> tables = new();

    /// <summary>Tables fetched over the network since start (a later search on the same table fetches nothing).</summary>
    public int Fetches { get; private set; }

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
            var cached = await File.ReadAllBytesAsync(path, cancellation);
            if (Matches(cached, hash))
            {
                CacheFolder.Touch(path);
                return TableCodec.Decode(cached, path);
            }

            File.Delete(path);
        }

        var bytes = await FetchAsync(hash, cancellation);
        CacheFolder.Ensure(options.CacheDirectory);
        string partial = path + "." + Environment.ProcessId + ".part";
        await CacheFolder.WriteAsync(partial, bytes, cancellation);
        File.Move(partial, path, overwrite: true);
        CacheFolder.Prune(options.CacheDirectory, Math.Max(options.CacheLimitBytes, bytes.LongLength));
        return TableCodec.Decode(bytes, path);
    }

    private async Task<byte[]> FetchAsync(string hash, CancellationToken cancellation)
    {
        var dataset = grains.GetGrain<IDatasetGrain>(hash);
        long length = await dataset.LengthAsync();
        var bytes = new byte[length];
        for (long offset = 0; offset < length;)
        {
            cancellation.ThrowIfCancellationRequested();
            var chunk = await dataset.ChunkAsync(offset, ChunkSize);
            if (chunk.Length == 0)
            {
                throw new IOException($"table {hash} ended early at byte {offset} of {length}");
            }

            chunk.CopyTo(bytes, offset);
            offset += chunk.Length;
        }

        if (!Matches(bytes, hash))
        {
            throw new IOException($"table {hash} arrived with a different hash; refusing it");
        }

        Fetches++;
        return bytes;
    }

    private static bool Matches(byte[] bytes, string hash) =>
        Convert.ToHexStringLower(SHA256.HashData(bytes)) == hash;
}
