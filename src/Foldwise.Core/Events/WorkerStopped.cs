namespace Foldwise.Core.Events;

/// <summary>This worker left for good (Ctrl-C or SIGTERM).</summary>
public sealed record WorkerStopped : SearchEvent;
