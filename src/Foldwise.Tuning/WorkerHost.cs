using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Events;
using Foldwise.Learners;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Tuning;

/// <summary>
/// A worker process: a silo with the worker role (no coordinator grains) that joins the coordinator and runs
/// slots until stopped. When the coordinator goes away (restart, sleep, network) the silo is torn down and a
/// fresh one joins again: a development-clustering cluster dies with its primary, so rejoining is the only way back.
/// </summary>
public sealed class WorkerHost(ClusterRole role, WorkerOptions options, IProgress<SearchEvent> events)
{
    /// <summary>How long the coordinator may stay unreachable before this worker starts over. Default 20 s.</summary>
    public TimeSpan LostAfter { get; init; } = TimeSpan.FromSeconds(20);

    /// <summary>The pause between attempts to join. Default 3 s.</summary>
    public TimeSpan RetryPause { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>
    /// Called before a new attempt to join; the command line's fresh start (an exec of itself), so each attempt
    /// starts in a clean process. If it returns, the next attempt is made in this process.
    /// </summary>
    public Action<int>? StartOver { get; init; }

    /// <summary>Where this worker's traces and metrics go. Default: nowhere.</summary>
    public FoldwiseTelemetryOptions Telemetry { get; init; } = new();

    /// <summary>Attempts made before this process started (a fresh process continues the count).</summary>
    public int EarlierAttempts { get; init; }

    public async Task RunAsync(CancellationToken stopping)
    {
        events.Report(new WorkerStarting(options.Name, role.Join?.ToString() ?? "", role.Advertise.ToString(), role.Certificate is not null));
        int attempt = EarlierAttempts;
        while (!stopping.IsCancellationRequested)
        {
            attempt++;
            using var host = Build();
            try
            {
                await host.StartAsync(stopping);
                events.Report(new WorkerJoined(role.Join?.ToString() ?? "", options.Name, options.Slots, options.Threads));
                string why = await WatchAsync(host, stopping);
                if (!stopping.IsCancellationRequested)
                {
                    events.Report(new WorkerLostCluster(why));
                }
            }
            catch (OperationCanceledException) when (stopping.IsCancellationRequested)
            {
                // Ctrl-C while joining.
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                events.Report(new WorkerJoinFailed(role.Join?.ToString() ?? "", attempt, FirstLine(e), RetryPause));
            }

            await StopQuietly(host);
            await PauseAsync(stopping);
            if (StartOver is { } startOver && !stopping.IsCancellationRequested)
            {
                host.Dispose();
                startOver(attempt);
            }
        }

        events.Report(new WorkerStopped());
    }

    private IHost Build()
    {
        var builder = Host.CreateApplicationBuilder([]);
        ConsoleLogging.Configure(builder.Logging, role.Verbose);

        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = TimeSpan.FromSeconds(10));
        builder.UseOrleans(silo => silo.UseFoldwiseClustering(role));
        builder.Services.AddFoldwiseWorker(options, LearnerCatalog.BuiltIn, events);
        builder.Services.AddFoldwiseTelemetry(Telemetry);
        builder.Services.ExcludeCoordinatorGrains();
        // Registered after UseOrleans so it replaces Orleans' handler, which would end the whole process.
        builder.Services.AddSingleton<IFatalErrorHandler, StopSiloOnFatalError>();
        return builder.Build();
    }

    /// <summary>Returns when the worker should start over: the silo stopped itself, or the coordinator stayed unreachable.</summary>
    private async Task<string> WatchAsync(IHost host, CancellationToken stopping)
    {
        var lifetime = host.Services.GetRequiredService<IHostApplicationLifetime>();
        var board = host.Services.GetRequiredService<IGrainFactory>().GetGrain<ISearchBoardGrain>(0);
        using var either = CancellationTokenSource.CreateLinkedTokenSource(stopping, lifetime.ApplicationStopping);
        DateTime? unreachableSince = null;
        while (!either.IsCancellationRequested)
        {
            try
            {
                await board.ActiveSearchesAsync().WaitAsync(TimeSpan.FromSeconds(5), either.Token);
                unreachableSince = null;
            }
            catch (OperationCanceledException) when (either.IsCancellationRequested)
            {
                break;
            }
            catch (Exception e) when (e is not OperationCanceledException || !either.IsCancellationRequested)
            {
                unreachableSince ??= DateTime.UtcNow;
                if (DateTime.UtcNow - unreachableSince >= LostAfter)
                {
                    return $"coordinator unreachable for {LostAfter.TotalSeconds:F0} s: {FirstLine(e)}";
                }
            }

            try
            {
                await Task.Delay(TimeSpan.FromSeconds(2), either.Token);
            }
            catch (OperationCanceledException)
            {
                break;
            }
        }

        return "the silo was stopped by the cluster";
    }

    private static async Task StopQuietly(IHost host)
    {
        try
        {
            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
            await host.StopAsync(timeout.Token);
        }
        catch (Exception e) when (e is OperationCanceledException or InvalidOperationException or Orleans.Runtime.OrleansException or AggregateException)
        {
            // A silo that never joined, or lost its cluster, may not stop cleanly; the next one starts fresh.
        }
    }

    private async Task PauseAsync(CancellationToken stopping)
    {
        try
        {
            await Task.Delay(RetryPause, stopping);
        }
        catch (OperationCanceledException)
        {
            // Stopping.
        }
    }

    private static string FirstLine(Exception e) => (e.InnerException is { } inner && e is AggregateException ? inner : e).Message.Split('\n')[0].Trim();
}
