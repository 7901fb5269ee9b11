using System.Diagnostics;
using Foldwise.Cluster.Telemetry;

namespace Foldwise.Tuning.Tests;

/// <summary>One search is one trace: its span parents every trial (and so every fold) and the blend.</summary>
[Collection(QuickDemoCollection.Name)]
public sealed class SearchTraceTests(QuickDemoRun run)
{
    [Fact]
    public void The_search_span_parents_every_trial_span_and_the_blend_span_and_each_trial_its_folds()
    {
        // Given a finished run of the quick demo with spans exported to memory
        var root = Assert.Single(run.Spans, s => s.OperationName == FoldwiseTelemetry.SearchSpan && Equals(s.GetTagItem(FoldwiseTelemetry.SearchTag), run.Result.SearchId));
        var trace = run.Spans.Where(s => s.TraceId == root.TraceId).ToList();

        // Then the search span is the trace's root
        Assert.Equal(default, root.ParentSpanId);

        // And each of the 10 trials' span is its child, and each trial's 3 fold spans are children of that trial's span
        var trials = trace.Where(s => s.OperationName == FoldwiseTelemetry.TrialSpan).ToList();
        Assert.Equal(Enumerable.Range(1, 10), trials.Select(t => (int)t.GetTagItem("foldwise.trial")!).Order());
        Assert.All(trials, t => Assert.Equal(root.SpanId, t.ParentSpanId));
        Assert.All(trials, t => Assert.Equal(3, trace.Count(f => f.OperationName == FoldwiseTelemetry.FoldSpan && f.ParentSpanId == t.SpanId)));
        Assert.Equal(30, trace.Count(s => s.OperationName == FoldwiseTelemetry.FoldSpan));

        // And the blend's span is a child of the search span
        var blend = Assert.Single(trace, s => s.OperationName == FoldwiseTelemetry.BlendSpan);
        Assert.Equal(root.SpanId, blend.ParentSpanId);

        // And every attribute is namespaced
        Assert.All(trace.SelectMany(s => s.TagObjects), tag => Assert.StartsWith("foldwise.", tag.Key, StringComparison.Ordinal));
    }
}
