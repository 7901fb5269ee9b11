using System.Collections.Concurrent;

namespace Foldwise.Cluster.Coordination;

/// <summary>The encoded tables the coordinator serves to workers, by content hash.</summary>
public sealed class DatasetShelf
{
    private readonly ConcurrentDictionary<string, byte[]> tables = new();

    public void Put(string hash, byte[] encoded) => tables[hash] = encoded;

    public byte[] Get(string hash) =>
        tables.TryGetValue(hash, out var bytes)
            ? bytes
            : throw new InvalidOperationException($"table {hash} is not served by this coordinator");
}
