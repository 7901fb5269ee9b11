using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Workers;

/// <summary>
/// Runs this process's slots for as long as the silo runs. Before the first lease it trains a tiny model of each
/// family (a family that fails is not offered, with the reason) and introduces the worker to the coordinator, which
/// refuses another build; then each slot pulls its own leases of the families offered.
/// </summary>
public sealed partial class SlotPump(
    IGrainFactory grains,
    TrialDataCache data,
    ILearnerCatalog learners,
    WorkerOptions options,
    SlotStatistics statistics,
    WorkerStop stop,
    TimeProvider time,
    FoldwiseMetrics metrics,
    IProgress<SearchEvent> events,
    ILoggerFactory loggers) : BackgroundService
{
    private readonly ILogger logger = loggers.CreateLogger<SlotPump>();

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (options.Slots == 0)
        {
            return;
        }

        string[] offered = await Task.Factory.StartNew(SelfTest, stoppingToken, TaskCreationOptions.LongRunning, TaskScheduler.Default);
        if (offered.Length == 0)
        {
            Refuse($"no family trains on this machine ({string.Join(", ", learners.Families)} failed their self-test; see above)");
            return;
        }

        if (await JoinAsync(offered, stoppingToken) is { } refusal)
        {
            Refuse(refusal);
            return;
        }

        var runnerLog = loggers.CreateLogger<SlotRunner>();

        // One keep for all slots: a promotion continues its screen's folds whichever slot of this worker it lands on.
        using var screens = new ScreenedFits();
        await Task.WhenAll(Enumerable.Range(0, options.Slots).Select(i =>
            new SlotRunner(i.ToString(), offered, grains, data, learners, screens, options, statistics, time, metrics, events, runnerLog).RunAsync(stoppingToken)));
    }

    private string[] SelfTest()
    {
        var offered = new List<string>();
        foreach (string family in learners.Families)
        {
            if (LearnerSelfTest.Problem(learners.Get(family)) is { } problem)
            {
                var missing = learners.MissingLibraries();
                string why = missing.Count > 0 ? $"{string.Join("; ", missing)} ({problem})" : problem;
                LogFamilyRefused(family, why);
                events.Report(new FamilyNotOffered(family, why));
            }
            else
            {
                offered.Add(family);
            }
        }

        return [.. offered];
    }

    /// <summary>Null once admitted; the refusal line otherwise. Retries while the coordinator cannot be reached.</summary>
    private async Task<string?> JoinAsync(string[] offered, CancellationToken stopping)
    {
        var hello = new WorkerHello(options.Name, options.Version, offered);
        var pause = options.PollInterval;
        while (true)
        {
            try
            {
                return await grains.GetGrain<ISearchBoardGrain>(0).JoinAsync(hello).WaitAsync(stopping);
            }
            catch (Exception e) when (e is not OperationCanceledException)
            {
                // The coordinator may still be starting; the worker host reports a coordinator that stays away.
                await Task.Delay(pause, time, stopping);
                pause = TimeSpan.FromTicks(Math.Min(TimeSpan.FromSeconds(5).Ticks, pause.Ticks * 2));
            }
        }
    }

    private void Refuse(string line)
    {
        LogRefused(line);
        stop.Request(line);
    }

    [LoggerMessage(Level = LogLevel.Warning, Message = "{Family} cannot train on this machine and is not offered: {Problem}")]
    private partial void LogFamilyRefused(string family, string problem);

    [LoggerMessage(Level = LogLevel.Error, Message = "This worker cannot take trials: {Line}")]
    private partial void LogRefused(string line);
}
