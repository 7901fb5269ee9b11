using System.Collections.Immutable;
using System.Diagnostics;
using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;
using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;

namespace Foldwise.Cluster.Tests.Telemetry;

[Trait(Lane.Key, Lane.Slow)]
[Collection(TwoSiloCollection.Name)]
public sealed class TelemetryTests(TwoSiloCluster fixture)
{
    [Fact]
    public async Task An_in_memory_exporter_sees_one_trace_per_search_across_both_silos_and_the_trial_metrics()
    {
        // Given Foldwise telemetry registered with in-memory exporters
        var spans = new List<Activity>();
        var metrics = new List<MetricSnapshot>();
        using var services = new ServiceCollection()
            .AddFoldwiseTelemetry(new FoldwiseTelemetryOptions
            {
                Tracing = t => t.AddInMemoryExporter(spans),
                Metrics = m => m.AddInMemoryExporter(metrics),
            })
            .BuildServiceProvider();
        var tracer = services.GetRequiredService<TracerProvider>();
        var meter = services.GetRequiredService<MeterProvider>();

        // When a search of 4 trials of 3 folds runs on both silos under its search span, and metrics are collected once mid-search and once after
        fixture.Learner.Delay = TimeSpan.FromMilliseconds(150);
        var search = new SearchSpan("telemetry", "telemetry");
        var firstDone = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var events = new SyncEvents(e => _ = e is TrialScored && firstDone.TrySetResult());
        var session = SearchSessions.Start(fixture, "telemetry", SearchSessions.Tables(), trials: 4, new MemoryRecorder(), events: events, search: search.Context);
        await firstDone.Task.WaitAsync(TimeSpan.FromSeconds(60));
        Assert.True(meter.ForceFlush(10_000));
        var midSearch = metrics.Select(m => m.Name).ToHashSet();
        var bestMid = metrics.FirstOrDefault(m => m.Name == FoldwiseTelemetry.BestScore);
        await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));
        fixture.Coordinator.GetRequiredService<SessionRegistry>().Remove(session.SearchId);
        search.End(session.Coordinator.Progress());
        // A slot closes its trial span just after the coordinator has the result, so the last one may trail the finish.
        for (int wait = 0; wait < 100 && spans.Count(s => s.OperationName == FoldwiseTelemetry.TrialSpan && Equals(s.GetTagItem("foldwise.search"), session.SearchId)) < 4; wait++)
        {
            await Task.Delay(50);
        }

        Assert.True(tracer.ForceFlush(10_000));
        Assert.True(meter.ForceFlush(10_000));

        // Activity listening is process-wide: other tests' spans could still land in the list while it is read, so the
        // tracer stops listening first (a read once failed with "Collection was modified").
        tracer.Dispose();

        // Then one search span parents one trial span per scored trial, on either silo (the lease carried its context),
        // and each trial span holds one span per fold
        var root = Assert.Single(spans, s => s.OperationName == FoldwiseTelemetry.SearchSpan && s.TraceId == search.Context.TraceId);
        Assert.Equal(default, root.ParentSpanId);
        var mine = spans.Where(s => Equals(s.GetTagItem("foldwise.search"), session.SearchId)).ToList();
        var trials = mine.Where(s => s.OperationName == FoldwiseTelemetry.TrialSpan && Equals(s.GetTagItem("foldwise.outcome"), "scored")).ToList();
        Assert.Equal([1, 2, 3, 4], trials.Select(s => (int)s.GetTagItem("foldwise.trial")!).Order());
        Assert.Contains(trials, s => Equals(s.GetTagItem("foldwise.worker"), "worker"));
        Assert.All(trials, t => Assert.Equal((root.TraceId, root.SpanId), (t.TraceId, t.ParentSpanId)));
        Assert.All(trials, trial =>
        {
            var folds = spans.Where(s => s.OperationName == FoldwiseTelemetry.FoldSpan && s.ParentSpanId == trial.SpanId).ToList();
            Assert.Equal([0, 1, 2], folds.Select(f => (int)f.GetTagItem("foldwise.fold")!).Order());
            Assert.All(folds, f => Assert.Equal(trial.TraceId, f.TraceId));
        });

        // And the metrics: trials done, durations in second-scale buckets, busy slots, queue and best score while running, Orleans' own
        Assert.Contains(FoldwiseTelemetry.QueueLength, midSearch);
        Assert.Contains(FoldwiseTelemetry.BusySlots, midSearch);
        Assert.NotNull(bestMid);
        Assert.Contains(Points(bestMid), p => HasTag(p, FoldwiseTelemetry.FamilyTag, FamilyNames.LightGbm));
        var done = metrics.Last(m => m.Name == FoldwiseTelemetry.TrialsDone);
        Assert.True(Points(done).Where(p => Scored(p)).Sum(p => p.GetSumLong()) >= 4);
        var duration = metrics.Last(m => m.Name == FoldwiseTelemetry.TrialDuration);
        Assert.Equal("s", duration.Unit);
        var point = Points(duration).First(Scored);
        Assert.True(point.GetHistogramCount() >= 1);
        var bounds = new List<double>();
        foreach (var bucket in point.GetHistogramBuckets())
        {
            bounds.Add(bucket.ExplicitBound);
        }

        Assert.Equal([.. FoldwiseTelemetry.DurationBuckets, double.PositiveInfinity], bounds);
        Assert.Contains(metrics, m => m.MeterName == FoldwiseTelemetry.OrleansMeter);
    }

    private static bool Scored(MetricPoint p) => HasTag(p, FoldwiseTelemetry.OutcomeTag, "scored");

    private static bool HasTag(MetricPoint point, string key, string value)
    {
        foreach (var tag in point.Tags)
        {
            if (tag.Key == key && Equals(tag.Value, value))
            {
                return true;
            }
        }

        return false;
    }

    private static List<MetricPoint> Points(MetricSnapshot metric) => [.. metric.MetricPoints];


}
