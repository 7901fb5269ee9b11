namespace Foldwise.Core.Search;

/// <summary>Why a search stopped creating trials.</summary>
public enum StopReason
{
    TrialBudget,
    HoursBudget,
    ScheduleExhausted,
    Requested,
}
