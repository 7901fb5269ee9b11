namespace Foldwise.Core.Events;

/// <summary>The coordinator this worker joined runs a search it now takes trials of.</summary>
public sealed record WorkerOnSearch(string SearchId) : SearchEvent;
