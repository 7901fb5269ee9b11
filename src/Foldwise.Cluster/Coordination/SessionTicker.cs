using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Coordination;

/// <summary>Ticks every running search once a second (lease expiry, time spent), on the coordinator.</summary>
public sealed partial class SessionTicker(SessionRegistry sessions, TimeProvider time, ILogger<SessionTicker> logger) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        using var timer = new PeriodicTimer(TimeSpan.FromSeconds(1), time);
        try
        {
            while (await timer.WaitForNextTickAsync(stoppingToken))
            {
                foreach (var session in sessions.All)
                {
                    try
                    {
                        session.Tick();
                    }
                    catch (IOException e)
                    {
                        LogTickFailed(session.SearchId, e);
                    }
                }
            }
        }
        catch (OperationCanceledException)
        {
            // Host stopping.
        }
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "Could not update search {SearchId}")]
    private partial void LogTickFailed(string searchId, Exception error);
}
