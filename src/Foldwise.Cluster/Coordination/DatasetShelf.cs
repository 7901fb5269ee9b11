using System.Collections.Concurrent;

namespace Foldwise.Cluster.Coordination;

/// <summary>The encoded table files the coordinator serves to workers, by content hash.</summary>
public sealed class DatasetShelf
{
    private readonly ConcurrentDictionary<string, ShelvedTable> tables = new();

    /// <summary>Serves the table file at <paramref name="path"/> under its hash, after checking it holds that table.</summary>
    public void Put(string hash, string path) => tables[hash] = ShelvedTable.Open(hash, path);

    public ShelvedTable Get(string hash) =>
        tables.TryGetValue(hash, out var table)
            ? table
            : throw new InvalidOperationException($"table {hash} is not served by this coordinator");
}
