using System.Diagnostics;

namespace Foldwise.Cluster.Telemetry;

/// <summary>
/// One span per fold fit, timed from Core's fold-done callback (Core stays free of telemetry): the first fold's span
/// opens when the trial starts, each callback closes the fold that finished and opens the next.
/// </summary>
public sealed class FoldSpans(ActivityContext parent, int trialId, int foldCount) : IDisposable
{
    private Activity? current = Open(parent, trialId, 0, foldCount);

    /// <summary>The callback for <c>TrialExecutor.Run</c>'s <c>foldDone</c>.</summary>
    public void FoldDone(int fold)
    {
        current?.Dispose();
        current = fold + 1 < foldCount ? Open(parent, trialId, fold + 1, foldCount) : null;
    }

    /// <summary>Closes a fold cut short (cancelled or failed) as an error.</summary>
    public void Dispose()
    {
        current?.SetStatus(ActivityStatusCode.Error, "the fold did not finish");
        current?.Dispose();
        current = null;
    }

    private static Activity? Open(ActivityContext parent, int trialId, int fold, int foldCount)
    {
        // Started without becoming Activity.Current of the calling thread beyond this span's life.
        var previous = Activity.Current;
        var activity = FoldwiseTelemetry.Source.StartActivity(FoldwiseTelemetry.FoldSpan, ActivityKind.Internal, parent);
        activity?.SetTag("foldwise.trial", trialId).SetTag("foldwise.fold", fold).SetTag("foldwise.folds", foldCount);
        Activity.Current = previous;
        return activity;
    }
}
