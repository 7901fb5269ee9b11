using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Grains;

/// <summary>Lists the searches the coordinator runs, read from its registry (nothing kept in the grain).</summary>
[GrainType(GrainNames.Board)]
internal sealed class SearchBoardGrain(SessionRegistry sessions) : Grain, ISearchBoardGrain
{
    public Task<string[]> ActiveSearchesAsync() =>
        Task.FromResult(sessions.All.Where(s => !s.Finished.IsCompleted).Select(s => s.SearchId).ToArray());
}
