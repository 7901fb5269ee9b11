using System.Diagnostics;
using Foldwise.Core.Search;

namespace Foldwise.Cluster.Telemetry;

/// <summary>The span of one search on its coordinator: opened with the session, closed once when it finishes, with the outcome as tags.</summary>
public sealed class SearchSpan
{
    private readonly Activity? activity;
    private int ended;

    public SearchSpan(string searchId, string name)
    {
        // A root span that does not become the creating thread's Activity.Current: the session outlives that call.
        var previous = Activity.Current;
        Activity.Current = null;
        activity = FoldwiseTelemetry.Source.StartActivity(FoldwiseTelemetry.SearchSpan, ActivityKind.Server);
        activity?.SetTag("foldwise.search", searchId).SetTag("foldwise.search.name", name);
        Activity.Current = previous;
    }

    public ActivityContext Context => activity?.Context ?? default;

    public void End(SearchProgress progress)
    {
        ArgumentNullException.ThrowIfNull(progress);
        if (activity is null || Interlocked.Exchange(ref ended, 1) == 1)
        {
            return;
        }

        activity.SetTag("foldwise.trials.done", progress.Done).SetTag("foldwise.trials.failed", progress.Failed)
            .SetTag("foldwise.stop", progress.Stopping?.ToString()).SetTag("foldwise.score.best", progress.Best);
        activity.Stop();
    }
}
