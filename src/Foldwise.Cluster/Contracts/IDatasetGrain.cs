namespace Foldwise.Cluster.Contracts;

/// <summary>
/// A screened table's encoded bytes, keyed by their SHA-256. Workers fetch it chunk by chunk once, check each
/// chunk and the whole, and keep it on local disk; it lives on the coordinator, which reads it from its file.
/// </summary>
[Alias("Foldwise.IDatasetGrain")]
public interface IDatasetGrain : IGrainWithStringKey
{
    Task<TableListing> ListingAsync();

    Task<byte[]> ChunkAsync(int index);
}
