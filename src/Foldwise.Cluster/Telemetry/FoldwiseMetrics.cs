using System.Collections.Concurrent;
using System.Diagnostics.Metrics;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Telemetry;

/// <summary>
/// Foldwise's instruments on <see cref="FoldwiseTelemetry.Meter"/>: trials done (counter, by family and outcome),
/// trial duration (histogram, seconds), busy slots of this process, and per running search its queue length and
/// best score per family (observable gauges, read when the exporter collects).
/// </summary>
public static class FoldwiseMetrics
{
    private static readonly ConcurrentDictionary<string, CoordinatorSession> Sessions = new();
    private static int busySlots;

    private static readonly Counter<long> Done = FoldwiseTelemetry.Meter.CreateCounter<long>(
        FoldwiseTelemetry.TrialsDone, "{trial}", "Trials a slot finished, by family and outcome (scored, failed, lost).");

    private static readonly Histogram<double> Duration = FoldwiseTelemetry.Meter.CreateHistogram(
        FoldwiseTelemetry.TrialDuration, "s", "Wall-clock seconds a slot spent on one trial attempt.",
        advice: new InstrumentAdvice<double> { HistogramBucketBoundaries = FoldwiseTelemetry.DurationBuckets });

    static FoldwiseMetrics()
    {
        FoldwiseTelemetry.Meter.CreateObservableGauge(FoldwiseTelemetry.BusySlots, () => Volatile.Read(ref busySlots), "{slot}", "Slots of this process training a trial now.");
        FoldwiseTelemetry.Meter.CreateObservableGauge(FoldwiseTelemetry.QueueLength, ObserveQueues, "{trial}", "Trials created and waiting for a slot, per search.");
        FoldwiseTelemetry.Meter.CreateObservableGauge(FoldwiseTelemetry.BestScore, ObserveBest, null, "Best out-of-fold score so far (fitting scale), per search and family.");
    }

    /// <summary>Reports a search's queue and best scores until it finishes.</summary>
    public static void Track(CoordinatorSession session)
    {
        ArgumentNullException.ThrowIfNull(session);
        Sessions[session.SearchId] = session;
        session.Finished.ContinueWith(_ => Sessions.TryRemove(session.SearchId, out CoordinatorSession? _), TaskScheduler.Default);
    }

    public static void SlotBusy() => Interlocked.Increment(ref busySlots);

    public static void SlotIdle() => Interlocked.Decrement(ref busySlots);

    public static void TrialEnded(string family, string outcome, double seconds)
    {
        var tags = new KeyValuePair<string, object?>[] { new("family", family), new("outcome", outcome) };
        Done.Add(1, tags);
        Duration.Record(seconds, tags);
    }

    private static IEnumerable<Measurement<int>> ObserveQueues() =>
        [.. Sessions.Values.Select(s => new Measurement<int>(s.Coordinator.Progress().Queued, new KeyValuePair<string, object?>("search", s.SearchId)))];

    private static IEnumerable<Measurement<double>> ObserveBest() =>
        [.. Sessions.Values.SelectMany(s => s.Coordinator.Progress().BestByFamily.Select(b => new Measurement<double>(
            b.Value, new KeyValuePair<string, object?>("search", s.SearchId), new KeyValuePair<string, object?>("family", b.Key))))];
}
