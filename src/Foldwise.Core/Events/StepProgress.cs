namespace Foldwise.Core.Events;

/// <summary>
/// A long preparation step is under way: <paramref name="Done"/> of <paramref name="Total"/> (bytes or columns, by
/// <paramref name="Step"/>) of <paramref name="Subject"/> (a file name, a table) after <paramref name="Elapsed"/>.
/// Reported only for steps that last more than a moment (<see cref="ProgressPacer"/>).
/// </summary>
public sealed record StepProgress(PreparationStep Step, string Subject, long Done, long Total, TimeSpan Elapsed) : SearchEvent
{
    /// <summary>Done over total, 0 to 1 (0 when the total is unknown).</summary>
    public double Fraction => Total > 0 ? Math.Clamp((double)Done / Total, 0, 1) : 0;
}
