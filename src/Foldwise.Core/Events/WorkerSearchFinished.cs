namespace Foldwise.Core.Events;

/// <summary>A search this worker took trials of has finished; it leaves when <paramref name="Leaving"/>, otherwise it waits for the next.</summary>
public sealed record WorkerSearchFinished(string SearchId, bool Leaving) : SearchEvent;
