namespace Foldwise.Core.Search;

/// <summary>
/// When a slot asks for work and nothing can start, decides whether it should run a backup copy of a trial
/// that is taking far longer than its budget predicts (a machine someone is using, a slow disk). The first
/// copy to report wins; the other's next renewal is refused. This is speculative execution as in MapReduce's
/// backup tasks (Dean &amp; Ghemawat, OSDI 2004); the factor and the sample size are our choice.
/// </summary>
public sealed class StragglerWatch
{
    private readonly double[] recent = new double[128];
    private readonly double factor;
    private readonly int minimumDone;
    private int count;
    private int next;

    /// <param name="factor">A trial is a straggler once it has run this many times its expected time.</param>
    /// <param name="minimumDone">Finished trials needed before any time is expected of a trial.</param>
    public StragglerWatch(double factor, int minimumDone)
    {
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(factor, 1.0);
        ArgumentOutOfRangeException.ThrowIfLessThan(minimumDone, 1);
        this.factor = factor;
        this.minimumDone = minimumDone;
    }

    /// <summary>Learns seconds per unit of budget from a finished trial (the most recent 128 count).</summary>
    public void Finished(int budget, TimeSpan duration)
    {
        if (budget <= 0 || duration <= TimeSpan.Zero)
        {
            return;
        }

        recent[next] = duration.TotalSeconds / budget;
        next = (next + 1) % recent.Length;
        count = Math.Min(count + 1, recent.Length);
    }

    /// <summary>
    /// The running trial most overdue relative to its expected time, among those running on other workers than
    /// the one asking (a slow machine's other slot is no faster) with fewer than two copies (three while
    /// draining); null when none is overdue.
    /// </summary>
    /// <param name="draining">The search creates no more trials: idle slots cost nothing, so a trial past its expected time (not twice it) is backed up.</param>
    public int? Pick(IEnumerable<(int TrialId, int Budget, IReadOnlyList<LeaseHold> Holds)> running, string worker, DateTimeOffset now, bool draining)
    {
        if (count < minimumDone)
        {
            return null;
        }

        double rate = MedianRate();
        int? pick = null;
        double worst = draining ? 1.0 : factor;
        foreach (var (id, budget, holds) in running)
        {
            if (holds.Count >= (draining ? 3 : 2) || holds.Any(h => h.Worker == worker))
            {
                continue;
            }

            // Overdue is measured on the newest copy: a fresh backup gets its own expected time before another.
            double overdue = (now - holds.Max(h => h.Started)).TotalSeconds / (rate * budget);
            if (overdue >= worst)
            {
                worst = overdue;
                pick = id;
            }
        }

        return pick;
    }

    private double MedianRate()
    {
        var sorted = recent.AsSpan(0, count).ToArray();
        Array.Sort(sorted);
        return sorted[sorted.Length / 2];
    }
}
