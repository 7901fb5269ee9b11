using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Grains;

/// <summary>Serves a table's listing and its chunks from the coordinator's shelf, read from disk one chunk per call.</summary>
[GrainType(GrainNames.Dataset)]
internal sealed class DatasetGrain(DatasetShelf shelf) : Grain, IDatasetGrain
{
    private ShelvedTable Table => shelf.Get(this.GetPrimaryKeyString());

    public Task<TableListing> ListingAsync() => Task.FromResult(Table.Listing);

    public Task<byte[]> ChunkAsync(int index) => Task.FromResult(Table.Chunk(index));
}
