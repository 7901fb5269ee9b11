using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Grains;

/// <summary>Serves a table's bytes from the coordinator's shelf, a chunk at a time (messages stay small).</summary>
[GrainType(GrainNames.Dataset)]
internal sealed class DatasetGrain(DatasetShelf shelf) : Grain, IDatasetGrain
{
    /// <summary>The largest chunk served in one call; 4 MiB keeps each message far below Orleans' limits.</summary>
    public const int MaxChunk = 4 << 20;

    private byte[] Bytes => shelf.Get(this.GetPrimaryKeyString());

    public Task<long> LengthAsync() => Task.FromResult((long)Bytes.Length);

    public Task<byte[]> ChunkAsync(long offset, int count)
    {
        var bytes = Bytes;
        ArgumentOutOfRangeException.ThrowIfNegative(offset);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(offset, bytes.Length);
        int take = (int)Math.Min(Math.Min(count, MaxChunk), bytes.Length - offset);
        return Task.FromResult(bytes.AsSpan((int)offset, take).ToArray());
    }
}
