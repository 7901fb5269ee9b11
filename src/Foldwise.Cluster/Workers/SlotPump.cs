using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Microsoft.Extensions.Hosting;
using Microsoft.Extensions.Logging;

namespace Foldwise.Cluster.Workers;

/// <summary>Runs this process's slots for as long as the silo runs; each slot pulls its own leases.</summary>
public sealed class SlotPump(
    IGrainFactory grains,
    TrialDataCache data,
    ILearnerCatalog learners,
    WorkerOptions options,
    SlotStatistics statistics,
    TimeProvider time,
    FoldwiseMetrics metrics,
    IProgress<SearchEvent> events,
    ILoggerFactory loggers) : BackgroundService
{
    protected override Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var logger = loggers.CreateLogger<SlotRunner>();
        return Task.WhenAll(Enumerable.Range(0, options.Slots).Select(i =>
            new SlotRunner(i.ToString(), grains, data, learners, options, statistics, time, metrics, events, logger).RunAsync(stoppingToken)));
    }
}
