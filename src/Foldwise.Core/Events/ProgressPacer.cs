namespace Foldwise.Core.Events;

/// <summary>
/// Reports a long preparation step's progress as <see cref="StepProgress"/> when <see cref="ReportPace"/> says it is
/// due. Callers tick it as often as is cheap for them.
/// </summary>
public sealed class ProgressPacer
{
    private readonly ReportPace pace;
    private readonly Action<StepProgress> report;
    private readonly PreparationStep step;
    private readonly string subject;

    public ProgressPacer(PreparationStep step, string subject, Action<StepProgress> report, TimeProvider? time = null)
    {
        ArgumentNullException.ThrowIfNull(report);
        this.step = step;
        this.subject = subject;
        this.report = report;
        pace = new ReportPace(time);
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
        if (pace.Due(out var elapsed))
        {
            report(new StepProgress(step, subject, done, total, elapsed));
        }
    }
}
