namespace Foldwise.Core.Events;

/// <summary>A slot of this worker could not run a trial and gave its lease back with the reason.</summary>
public sealed record SlotTrialFailed(string Worker, string Slot, int TrialId, int Attempt, string Reason) : SearchEvent;
