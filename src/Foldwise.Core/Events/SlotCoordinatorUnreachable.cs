namespace Foldwise.Core.Events;

/// <summary>A slot of this worker could not reach the coordinator and asks again after a pause.</summary>
public sealed record SlotCoordinatorUnreachable(string Worker, string Slot, string Reason) : SearchEvent;
