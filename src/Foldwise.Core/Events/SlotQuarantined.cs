namespace Foldwise.Core.Events;

/// <summary>The coordinator takes no more trials from this worker in that search: its trials failed several times in a row while others succeeded.</summary>
public sealed record SlotQuarantined(string Worker, string Slot, string SearchId, string Reason) : SearchEvent;
