namespace Foldwise.Core.Events;

/// <summary>
/// How far a slot's trial of a family that trains round by round has come, <paramref name="Elapsed"/> after it started:
/// while <paramref name="Round"/> is 0, <paramref name="FoldsReady"/> of its <paramref name="Folds"/> folds have their
/// rows prepared (binned); then <paramref name="Round"/> of its <paramref name="Budget"/> rounds are trained on every
/// fold. Its folds finish together at the end, so fold lines come only then. Reported at most once a second after its
/// first seconds (<see cref="ReportPace"/>); plain logs show it only for long trials (<see cref="SlotFoldFitted.LongTrial"/>).
/// </summary>
public sealed record SlotTrialAdvanced(string Worker, string Slot, int TrialId, int FoldsReady, int Folds, int Round, int Budget, TimeSpan Elapsed) : SearchEvent
{
    public bool IsLong => Elapsed >= SlotFoldFitted.LongTrial;

    /// <summary>Where the trial stands, for a progress line: the folds prepared, then the rounds trained.</summary>
    public string Stage => Round == 0 ? $"{FoldsReady} of {Folds} folds prepared" : $"round {Round} of {Budget} trained on every fold";
}
