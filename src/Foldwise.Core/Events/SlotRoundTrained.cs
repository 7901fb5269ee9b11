namespace Foldwise.Core.Events;

/// <summary>
/// A slot's trial of a family that trains round by round has trained <paramref name="Round"/> of its
/// <paramref name="Budget"/> rounds on every fold, <paramref name="Elapsed"/> after the trial started (its folds finish
/// together at the end, so this is how far it has come). Reported at most once a second after its first seconds
/// (<see cref="ReportPace"/>); plain logs show it only for long trials (<see cref="SlotFoldFitted.LongTrial"/>).
/// </summary>
public sealed record SlotRoundTrained(string Worker, string Slot, int TrialId, int Round, int Budget, TimeSpan Elapsed) : SearchEvent
{
    public bool IsLong => Elapsed >= SlotFoldFitted.LongTrial;
}
