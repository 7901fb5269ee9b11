namespace Foldwise.Core.Events;

/// <summary>
/// A slot finished fold <paramref name="Fold"/> (0-based) of <paramref name="Folds"/> of a trial, <paramref name="Elapsed"/>
/// after the trial started. Plain logs show it only for long trials (<see cref="LongTrial"/>).
/// </summary>
public sealed record SlotFoldFitted(string Worker, string Slot, int TrialId, int Fold, int Folds, TimeSpan Elapsed) : SearchEvent
{
    /// <summary>A trial that has run this long gets a line per fold in a plain log.</summary>
    public static readonly TimeSpan LongTrial = TimeSpan.FromSeconds(10);

    public bool IsLong => Elapsed >= LongTrial;
}
