namespace Foldwise.Cluster.Contracts;

/// <summary>
/// A screened table's encoded bytes, keyed by their SHA-256. Workers fetch it in chunks once, check the hash,
/// and keep it on local disk; it lives on the coordinator, which holds the bytes.
/// </summary>
[Alias("Foldwise.IDatasetGrain")]
public interface IDatasetGrain : IGrainWithStringKey
{
    Task<long> LengthAsync();

    Task<byte[]> ChunkAsync(long offset, int count);
}
