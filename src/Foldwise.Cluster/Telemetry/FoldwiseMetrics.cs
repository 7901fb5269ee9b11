using System.Diagnostics.Metrics;
using Foldwise.Cluster.Coordination;

namespace Foldwise.Cluster.Telemetry;

/// <summary>
/// Foldwise's instruments, on a <c>Foldwise</c> meter of the host's <see cref="IMeterFactory"/>: trials done
/// (counter, by family and outcome), trial duration (histogram, seconds), busy slots of this process, and on a
/// coordinator, per running search, its queue length and best score per family (observable gauges read from the
/// host's <see cref="SessionRegistry"/> when the exporter collects). One per host, so nothing is shared between hosts.
/// </summary>
public sealed class FoldwiseMetrics
{
    private readonly Counter<long> done;
    private readonly Histogram<double> duration;
    private readonly SessionRegistry? sessions;
    private int busySlots;

    public FoldwiseMetrics(IMeterFactory meters, SessionRegistry? sessions = null)
    {
        ArgumentNullException.ThrowIfNull(meters);
        this.sessions = sessions;
        var meter = meters.Create(FoldwiseTelemetry.Name, FoldwiseTelemetry.Version);
        done = meter.CreateCounter<long>(FoldwiseTelemetry.TrialsDone, "{trial}", "Trials a slot finished, by family and outcome (scored, failed, lost).");
        duration = meter.CreateHistogram(
            FoldwiseTelemetry.TrialDuration, "s", "Wall-clock seconds a slot spent on one trial attempt.",
            advice: new InstrumentAdvice<double> { HistogramBucketBoundaries = FoldwiseTelemetry.DurationBuckets });
        meter.CreateObservableGauge(FoldwiseTelemetry.BusySlots, () => Volatile.Read(ref busySlots), "{slot}", "Slots of this process training a trial now.");
        meter.CreateObservableGauge(FoldwiseTelemetry.QueueLength, ObserveQueues, "{trial}", "Trials created and waiting for a slot, per search.");
        meter.CreateObservableGauge(FoldwiseTelemetry.BestScore, ObserveBest, null, "Best out-of-fold score so far (fitting scale), per search and family.");
    }

    public void SlotBusy() => Interlocked.Increment(ref busySlots);

    public void SlotIdle() => Interlocked.Decrement(ref busySlots);

    public void TrialEnded(string family, string outcome, double seconds)
    {
        var tags = new KeyValuePair<string, object?>[] { new(FoldwiseTelemetry.FamilyTag, family), new(FoldwiseTelemetry.OutcomeTag, outcome) };
        done.Add(1, tags);
        duration.Record(seconds, tags);
    }

    private IEnumerable<Measurement<int>> ObserveQueues() =>
        [.. Running().Select(s => new Measurement<int>(s.Coordinator.Progress().Queued, new KeyValuePair<string, object?>(FoldwiseTelemetry.SearchTag, s.SearchId)))];

    private IEnumerable<Measurement<double>> ObserveBest() =>
        [.. Running().SelectMany(s => s.Coordinator.Progress().BestByFamily.Select(b => new Measurement<double>(
            b.Value, new KeyValuePair<string, object?>(FoldwiseTelemetry.SearchTag, s.SearchId), new KeyValuePair<string, object?>(FoldwiseTelemetry.FamilyTag, b.Key))))];

    private IEnumerable<CoordinatorSession> Running() => sessions?.All.Where(s => !s.Finished.IsCompleted) ?? [];
}
