using Foldwise.Core.Events;

namespace Foldwise.Cli.Output;

/// <summary>
/// Lets a plain log show how far a long trial has come at most every <see cref="StepThrottle.Interval"/> per slot: the first
/// report of a long trial passes, then one per interval.
/// </summary>
internal sealed class AdvanceLineThrottle
{
    private readonly Dictionary<(string Worker, string Slot), (int TrialId, TimeSpan Shown)> lastShown = [];

    public bool Due(SlotTrialAdvanced advance)
    {
        if (!advance.IsLong)
        {
            return false;
        }

        var slot = (advance.Worker, advance.Slot);
        if (lastShown.TryGetValue(slot, out var last) && last.TrialId == advance.TrialId && advance.Elapsed - last.Shown < StepThrottle.Interval)
        {
            return false;
        }

        lastShown[slot] = (advance.TrialId, advance.Elapsed);
        return true;
    }
}
