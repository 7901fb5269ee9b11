namespace Foldwise.Cluster.Contracts;

/// <summary>
/// The cluster's notice board (a single grain, key <c>0</c>): which searches the coordinator runs now,
/// so a worker that joins knows where to ask for work.
/// </summary>
[Alias("Foldwise.ISearchBoardGrain")]
public interface ISearchBoardGrain : IGrainWithIntegerKey
{
    Task<string[]> ActiveSearchesAsync();

    /// <summary>A worker introduces itself before its first lease; null admits it, otherwise the one-line reason it is refused.</summary>
    Task<string?> JoinAsync(WorkerHello hello);
}
