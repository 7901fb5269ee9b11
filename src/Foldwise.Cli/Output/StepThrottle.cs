using Foldwise.Core.Events;

namespace Foldwise.Cli.Output;

/// <summary>
/// Lets a plain log show a long step at most every <see cref="Interval"/>: the first report of each step (by step and
/// subject) passes, then one per interval.
/// </summary>
internal sealed class StepThrottle
{
    public static readonly TimeSpan Interval = TimeSpan.FromSeconds(10);

    private TimeSpan? lastShown;
    private (PreparationStep, string)? lastStep;

    public bool Due(StepProgress step)
    {
        if (lastStep != (step.Step, step.Subject))
        {
            (lastStep, lastShown) = ((step.Step, step.Subject), null);
        }

        if (lastShown is { } last && step.Elapsed - last < Interval)
        {
            return false;
        }

        lastShown = step.Elapsed;
        return true;
    }
}
