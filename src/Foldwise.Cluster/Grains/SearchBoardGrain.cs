using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Grains;

/// <summary>Lists the searches the coordinator runs, read from its registry, and admits workers of the same build (nothing kept in the grain).</summary>
[GrainType(GrainNames.Board)]
internal sealed partial class SearchBoardGrain(SessionRegistry sessions, ILogger<SearchBoardGrain> logger) : Grain, ISearchBoardGrain
{
    public Task<string[]> ActiveSearchesAsync() =>
        Task.FromResult(sessions.All.Where(s => !s.Finished.IsCompleted).Select(s => s.SearchId).ToArray());

    public Task<string?> JoinAsync(WorkerHello hello)
    {
        if (JoinRule.Refusal(hello, Core.BuildVersion.Text) is { } refusal)
        {
            LogRefused(hello.Worker, refusal);
            return Task.FromResult<string?>(refusal);
        }

        LogAdmitted(hello.Worker, hello.Families);
        return Task.FromResult<string?>(null);
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "Refused worker {Worker}: {Reason}")]
    private partial void LogRefused(string worker, string reason);

    [LoggerMessage(Level = LogLevel.Information, Message = "Worker {Worker} joined, offering {Families}")]
    private partial void LogAdmitted(string worker, string[] families);
}
