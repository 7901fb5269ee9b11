namespace Foldwise.Core.Events;

/// <summary>
/// Decides when a long step reports its progress: nothing during its first <see cref="Quiet"/> (a short step shows
/// nothing), then at most once per <see cref="Interval"/>. Callers tick it as often as is cheap for them.
/// </summary>
public sealed class ProgressPacer
{
    public static readonly TimeSpan Quiet = TimeSpan.FromSeconds(2);

    public static readonly TimeSpan Interval = TimeSpan.FromSeconds(1);

    private readonly TimeProvider time;
    private readonly long started;
    private readonly Action<StepProgress> report;
    private readonly PreparationStep step;
    private readonly string subject;
    private TimeSpan? lastReport;

    public ProgressPacer(PreparationStep step, string subject, Action<StepProgress> report, TimeProvider? time = null)
    {
        ArgumentNullException.ThrowIfNull(report);
        this.step = step;
        this.subject = subject;
        this.report = report;
        this.time = time ?? TimeProvider.System;
        started = this.time.GetTimestamp();
    }

    /// <summary>A pacer that reports to a search's events.</summary>
    public static ProgressPacer For(PreparationStep step, string subject, IProgress<SearchEvent> events, TimeProvider? time = null)
    {
        ArgumentNullException.ThrowIfNull(events);
        return new ProgressPacer(step, subject, events.Report, time);
    }

    /// <summary>Reports <paramref name="done"/> of <paramref name="total"/> if the step has run long enough and the last report is old enough.</summary>
    public void Tick(long done, long total)
    {
        var elapsed = time.GetElapsedTime(started);
        if (elapsed < Quiet || (lastReport is { } last && elapsed - last < Interval))
        {
            return;
        }

        lastReport = elapsed;
        report(new StepProgress(step, subject, done, total, elapsed));
    }
}
