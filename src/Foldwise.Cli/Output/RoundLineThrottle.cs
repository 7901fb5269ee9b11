using Foldwise.Core.Events;

namespace Foldwise.Cli.Output;

/// <summary>
/// Lets a plain log show a long trial's rounds at most every <see cref="StepThrottle.Interval"/> per slot: the first
/// report of a long trial passes, then one per interval.
/// </summary>
internal sealed class RoundLineThrottle
{
    private readonly Dictionary<(string Worker, string Slot), (int TrialId, TimeSpan Shown)> lastShown = [];

    public bool Due(SlotRoundTrained round)
    {
        if (!round.IsLong)
        {
            return false;
        }

        var slot = (round.Worker, round.Slot);
        if (lastShown.TryGetValue(slot, out var last) && last.TrialId == round.TrialId && round.Elapsed - last.Shown < StepThrottle.Interval)
        {
            return false;
        }

        lastShown[slot] = (round.TrialId, round.Elapsed);
        return true;
    }
}
