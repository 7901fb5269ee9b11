namespace Foldwise.Core.Events;

/// <summary>
/// When long work says how far it has come: never during its first <see cref="Quiet"/> (short work shows nothing),
/// then at most once per <see cref="Interval"/>. Callers ask as often as is cheap for them.
/// </summary>
public sealed class ReportPace
{
    public static readonly TimeSpan Quiet = TimeSpan.FromSeconds(2);

    public static readonly TimeSpan Interval = TimeSpan.FromSeconds(1);

    private readonly TimeProvider time;
    private readonly long started;
    private TimeSpan? lastReport;

    /// <summary>Starts timing the work now.</summary>
    public ReportPace(TimeProvider? time = null)
    {
        this.time = time ?? TimeProvider.System;
        started = this.time.GetTimestamp();
    }

    /// <summary>True when a report is due now; <paramref name="elapsed"/> is the time since the work started.</summary>
    public bool Due(out TimeSpan elapsed)
    {
        elapsed = time.GetElapsedTime(started);
        if (elapsed < Quiet || (lastReport is { } last && elapsed - last < Interval))
        {
            return false;
        }

        lastReport = elapsed;
        return true;
    }
}
