namespace Foldwise.Core.Search;

/// <summary>
/// Decides what runs next. The coordinator tells it every change of every trial, in order
/// (also replaying the whole history when a search resumes), and asks it for a plan whenever a slot
/// is free and the queue is empty. It keeps its own indices so a decision stays fast with a long history.
/// </summary>
public interface ISchedule
{
    /// <summary>A trial was created or changed state.</summary>
    void Observe(TrialRecord trial);

    /// <summary>The next trial to create, or null when nothing can start until running trials finish.</summary>
    TrialPlan? NextPlan();

    /// <summary>True when the schedule will never propose again (e.g. every Hyperband bracket has run).</summary>
    bool Exhausted { get; }
}
