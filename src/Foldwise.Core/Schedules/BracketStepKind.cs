namespace Foldwise.Core.Schedules;

/// <summary>What one family's copy of a bracket can do next.</summary>
internal enum BracketStepKind
{
    /// <summary>Start a new candidate at rung 0.</summary>
    New,

    /// <summary>Promote a finished trial to the next rung.</summary>
    Promote,

    /// <summary>A rung is still running; synchronous halving waits for all of it.</summary>
    Waiting,

    /// <summary>The bracket has run to its end (or nothing finished to promote).</summary>
    Complete,
}
