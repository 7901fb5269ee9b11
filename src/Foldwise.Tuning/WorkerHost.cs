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

    /// <summary>How long joining may take before this worker checks its certificate against the coordinator's. Default 3 s.</summary>
    public TimeSpan ProbeAfter { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>Runs until stopped; returns null then, or the one line saying why this worker cannot work for the cluster.</summary>
    public async Task<string?> RunAsync(CancellationToken stopping)
    {
        events.Report(new WorkerStarting(options.Name, role.Join?.ToString() ?? "", role.Advertise.ToString(), role.Certificate is not null));
        int attempt = EarlierAttempts;
        bool waitingTold = false;
        while (!stopping.IsCancellationRequested)
        {
            // A silo started while nothing answers on the coordinator's port only fails after Orleans' own long retries:
            // wait here, said once, until the port answers.
            if (role.Join is { } join && !await ClusterProbe.AnswersAsync(join, RetryPause, stopping))
            {
                if (!waitingTold && !stopping.IsCancellationRequested)
                {
                    events.Report(new WorkerAwaitsCoordinator(join.ToString(), RetryPause));
                    waitingTold = true;
                }

                await PauseAsync(stopping);
                continue;
            }

            waitingTold = false;
            attempt++;
            using var host = Build();
            try
            {
                if (await StartOrMismatchAsync(host, stopping) is { } mismatch)
                {
                    events.Report(new WorkerRefused(role.Join?.ToString() ?? "", mismatch));
                    await StopQuietly(host);
                    return mismatch;
                }

                events.Report(new WorkerJoined(role.Join?.ToString() ?? "", options.Name, options.Slots, options.Threads));
                var end = await WatchAsync(host, stopping);
                if (end.Refusal is { } refusal)
                {
                    events.Report(new WorkerRefused(role.Join?.ToString() ?? "", refusal));
                    await StopQuietly(host);
                    return refusal;
                }

                if (end.Left)
                {
                    await StopQuietly(host);
                    break;
                }

                if (!stopping.IsCancellationRequested)
                {
                    events.Report(end.Rejoining);
                }
            }
            catch (Exception) when (stopping.IsCancellationRequested)
            {
                // Ctrl-C while joining or working: whatever the silo threw on its way down is not a failed join.
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
        return null;
    }

    /// <summary>
    /// Starts the silo; when joining takes longer than <see cref="ProbeAfter"/>, asks the coordinator's silo port whether
    /// the cluster certificates match (mutual TLS refuses a mismatch by closing the connection, which Orleans retries
    /// for a minute in silence). Returns the mismatch, or null once the silo has started.
    /// </summary>
    private async Task<string?> StartOrMismatchAsync(IHost host, CancellationToken stopping)
    {
        var starting = host.StartAsync(stopping);
        if (role.Join is { } join &&
            await Task.WhenAny(starting, Task.Delay(ProbeAfter, stopping)) != starting &&
            !stopping.IsCancellationRequested &&
            await ClusterProbe.MismatchAsync(join, role.Certificate, TimeSpan.FromSeconds(5), stopping) is { } mismatch)
        {
            // The start is abandoned with the host; its failure is not news.
            _ = starting.ContinueWith(t => t.Exception, CancellationToken.None, TaskContinuationOptions.OnlyOnFaulted, TaskScheduler.Default);
            return mismatch;
        }

        await starting;
        return null;
    }

    private IHost Build()
    {
        var builder = Host.CreateApplicationBuilder([]);
        ConsoleLogging.Configure(builder.Logging, role.Verbose, joining: true);

        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = TimeSpan.FromSeconds(10));
        builder.UseOrleans(silo => silo.UseFoldwiseClustering(role));
        builder.Services.AddFoldwiseWorker(options, LearnerCatalog.BuiltIn, events);
        builder.Services.AddFoldwiseTelemetry(Telemetry);
        builder.Services.ExcludeCoordinatorGrains();
        // Registered after UseOrleans so it replaces Orleans' handler, which would end the whole process.
        builder.Services.AddSingleton<IFatalErrorHandler, StopSiloOnFatalError>();
        return builder.Build();
    }

    /// <summary>
    /// Returns when the worker should start over (the silo stopped itself, or the coordinator stayed unreachable), leave
    /// (refused, or its search finished and it was asked to leave then), or was stopped. Says which search it works on,
    /// and plainly when that search finished, so the coordinator going away after a search is not mistaken for a fault.
    /// </summary>
    private async Task<WatchEnd> WatchAsync(IHost host, CancellationToken stopping)
    {
        var lifetime = host.Services.GetRequiredService<IHostApplicationLifetime>();
        var board = host.Services.GetRequiredService<IGrainFactory>().GetGrain<ISearchBoardGrain>(0);
        var stop = host.Services.GetRequiredService<WorkerStop>();
        using var either = CancellationTokenSource.CreateLinkedTokenSource(stopping, lifetime.ApplicationStopping);
        DateTime? unreachableSince = null;
        string[] active = [];
        string? finished = null;
        while (!either.IsCancellationRequested)
        {
            if (stop.Reason is { } refusal)
            {
                return WatchEnd.Refused(refusal);
            }

            try
            {
                string[] now = await board.ActiveSearchesAsync().WaitAsync(TimeSpan.FromSeconds(5), either.Token);
                unreachableSince = null;
                foreach (string started in now.Except(active))
                {
                    events.Report(new WorkerOnSearch(started));
                }

                foreach (string ended in active.Except(now))
                {
                    finished = ended;
                    events.Report(new WorkerSearchFinished(ended, options.LeaveWhenDone));
                    if (options.LeaveWhenDone)
                    {
                        return WatchEnd.Leave;
                    }
                }

                active = now;
            }
            catch (OperationCanceledException) when (either.IsCancellationRequested)
            {
                break;
            }
            catch (Exception e) when (e is not OperationCanceledException || !either.IsCancellationRequested)
            {
                if (unreachableSince is null && active.Length == 0 && finished is not null)
                {
                    events.Report(new WorkerCoordinatorGone(finished));
                }

                unreachableSince ??= DateTime.UtcNow;
                if (DateTime.UtcNow - unreachableSince >= LostAfter)
                {
                    return WatchEnd.Rejoin(finished is not null && active.Length == 0
                        ? new WorkerAwaitsNextSearch()
                        : new WorkerLostCluster($"coordinator unreachable for {LostAfter.TotalSeconds:F0} s: {FirstLine(e)}"));
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

        return stop.Reason is { } late ? WatchEnd.Refused(late) : WatchEnd.Rejoin(new WorkerLostCluster("the silo was stopped by the cluster"));
    }

    /// <summary>How watching ended: joining again (with the event saying why), refused, or leaving.</summary>
    private sealed record WatchEnd(SearchEvent Rejoining, string? Refusal, bool Left)
    {
        public static WatchEnd Leave { get; } = new(new WorkerStopped(), null, Left: true);

        public static WatchEnd Refused(string line) => new(new WorkerStopped(), line, Left: false);

        public static WatchEnd Rejoin(SearchEvent why) => new(why, null, Left: false);
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
