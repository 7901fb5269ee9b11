namespace Foldwise.Core.Events;

/// <summary>A slot of this worker lost its lease (renewal refused) and dropped the trial.</summary>
public sealed record SlotLeaseLost(string Worker, string Slot, int TrialId, int Attempt) : SearchEvent;
