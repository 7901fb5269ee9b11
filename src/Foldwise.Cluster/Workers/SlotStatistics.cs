namespace Foldwise.Cluster.Workers;

/// <summary>Busy and available time of this process's slots, for utilisation figures.</summary>
public sealed class SlotStatistics
{
    private long busyTicks;
    private int trialsRun;

    public TimeSpan Busy => TimeSpan.FromTicks(Interlocked.Read(ref busyTicks));

    public int TrialsRun => Volatile.Read(ref trialsRun);

    public void AddBusy(TimeSpan span)
    {
        Interlocked.Add(ref busyTicks, span.Ticks);
        Interlocked.Increment(ref trialsRun);
    }
}
