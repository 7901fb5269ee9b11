using Foldwise.Core.Definition;

namespace Foldwise.Core.Search;

/// <summary>
/// When a search stops creating trials, in order of precedence: a stop request (Ctrl-C), the wall-clock budget
/// (earlier sessions included), the trial budget, a schedule with nothing more to give. And when it has finished.
/// </summary>
public static class StopRules
{
    public static StopReason? Reason(bool stopRequested, SearchBudget budget, double spentSeconds, int trialsCreated, bool scheduleExhausted) =>
        stopRequested ? StopReason.Requested
        : budget.Hours is { } hours && spentSeconds >= hours * 3600 ? StopReason.HoursBudget
        : budget.Trials is { } trials && trialsCreated >= trials ? StopReason.TrialBudget
        : scheduleExhausted ? StopReason.ScheduleExhausted
        : null;

    /// <summary>
    /// Finished once stopped with nothing running; queued trials still run after a budget or a spent schedule,
    /// but not after a stop request or the hours budget (they wait for a resume).
    /// </summary>
    public static bool Finished(StopReason? stopping, int running, int queued) =>
        stopping is not null && running == 0 && (queued == 0 || stopping is StopReason.Requested or StopReason.HoursBudget);
}
