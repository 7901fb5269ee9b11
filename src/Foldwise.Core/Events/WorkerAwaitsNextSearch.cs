namespace Foldwise.Core.Events;

/// <summary>The coordinator went away after its search finished; this worker joins again to wait for its next search.</summary>
public sealed record WorkerAwaitsNextSearch : SearchEvent;
