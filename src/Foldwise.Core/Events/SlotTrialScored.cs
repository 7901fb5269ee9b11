namespace Foldwise.Core.Events;

/// <summary>A slot of this worker reported a trial; <paramref name="Accepted"/> is false for a late report of a lost lease.</summary>
public sealed record SlotTrialScored(string Worker, string Slot, int TrialId, int Attempt, double Score, TimeSpan Took, bool Accepted) : SearchEvent;
