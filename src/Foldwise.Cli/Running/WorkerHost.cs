using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Workers;
using Foldwise.Learners;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cli.Running;

/// <summary>
/// A worker process: a silo with the worker role (no coordinator grains) that joins the coordinator and runs
/// slots until stopped. When the coordinator goes away (restart, sleep, network) the silo is torn down and a
/// fresh one joins again: a development-clustering cluster dies with its primary, so rejoining is the only way back.
/// </summary>
public sealed class WorkerHost(ClusterRole role, WorkerOptions options, TextWriter output)
{
    /// <summary>How long the coordinator may stay unreachable before this worker starts over. Default 20 s.</summary>
    public TimeSpan LostAfter { get; init; } = TimeSpan.FromSeconds(20);

    /// <summary>The pause between attempts to join. Default 3 s.</summary>
    public TimeSpan RetryPause { get; init; } = TimeSpan.FromSeconds(3);

    /// <summary>
    /// Called before a new attempt to join; <see cref="FreshProcess.Restart"/> in the real command, so each attempt
    /// starts in a clean process. If it returns, the next attempt is made in this process.
    /// </summary>
    public Action<int>? StartOver { get; init; }

    /// <summary>Attempts made before this process started (a fresh process continues the count).</summary>
    public int EarlierAttempts { get; init; }

    /// <summary>Runs until stopped; returns null then, or the one line saying why this worker cannot work for the cluster.</summary>
    public async Task<string?> RunAsync(CancellationToken stopping)
    {
        int attempt = EarlierAttempts;
        while (!stopping.IsCancellationRequested)
        {
            attempt++;
            using var host = Build();
            try
            {
                await host.StartAsync(stopping);
                output.WriteLine($"Joined the cluster at {role.Join} as {options.Name} with {options.Slots} slot(s), {options.Threads} thread(s) each");
                var end = await WatchAsync(host, stopping);
                if (end.Refusal is { } refusal)
                {
                    output.WriteLine($"Cannot work for {role.Join}: {refusal}");
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
                    output.WriteLine(end.Why);
                }
            }
            catch (OperationCanceledException) when (stopping.IsCancellationRequested)
            {
                // Ctrl-C while joining.
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                output.WriteLine($"Cannot join {role.Join} (attempt {attempt}): {FirstLine(e)}; retrying in {RetryPause.TotalSeconds:F0} s");
            }

            await StopQuietly(host);
            await PauseAsync(stopping);
            if (StartOver is { } startOver && !stopping.IsCancellationRequested)
            {
                host.Dispose();
                startOver(attempt);
            }
        }

        output.WriteLine("Worker stopped");
        return null;
    }

    private IHost Build()
    {
        var builder = Host.CreateApplicationBuilder([]);
        ConsoleLogging.Configure(builder.Logging, role.Verbose);
        // The slots' information lines are printed by TrialLines below; the console logger keeps their warnings only.
        builder.Logging.AddFilter<Microsoft.Extensions.Logging.Console.ConsoleLoggerProvider>(typeof(SlotRunner).FullName, LogLevel.Warning);

        // One line per trial this worker runs, whatever the log level.
        builder.Logging.AddProvider(new TrialLines(output));
        builder.Services.Configure<HostOptions>(o => o.ShutdownTimeout = TimeSpan.FromSeconds(10));
        builder.UseOrleans(silo => silo.UseFoldwiseClustering(role));
        builder.Services.AddFoldwiseWorker(options, LearnerCatalog.BuiltIn);
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
                return new WatchEnd("", refusal, Left: false);
            }

            try
            {
                string[] now = await board.ActiveSearchesAsync().WaitAsync(TimeSpan.FromSeconds(5), either.Token);
                unreachableSince = null;
                foreach (string started in now.Except(active))
                {
                    output.WriteLine($"Working on search {started}");
                }

                foreach (string ended in active.Except(now))
                {
                    finished = ended;
                    output.WriteLine(options.LeaveWhenDone
                        ? $"Search {ended} finished; leaving as asked"
                        : $"Search {ended} finished; waiting for the next search (Ctrl-C to leave)");
                    if (options.LeaveWhenDone)
                    {
                        return new WatchEnd("", null, Left: true);
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
                    output.WriteLine($"The coordinator of search {finished} has stopped; waiting for it to run the next search");
                }

                unreachableSince ??= DateTime.UtcNow;
                if (DateTime.UtcNow - unreachableSince >= LostAfter)
                {
                    return new WatchEnd(
                        finished is not null && active.Length == 0
                            ? "Rejoining to wait for the coordinator's next search"
                            : $"Lost the cluster (coordinator unreachable for {LostAfter.TotalSeconds:F0} s: {FirstLine(e)}); joining again",
                        null,
                        Left: false);
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

        return new WatchEnd("Lost the cluster (the silo was stopped by the cluster); joining again", stop.Reason, Left: false);
    }

    /// <summary>How watching ended: the line to print before joining again, a refusal, or leaving.</summary>
    private sealed record WatchEnd(string Why, string? Refusal, bool Left);

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
