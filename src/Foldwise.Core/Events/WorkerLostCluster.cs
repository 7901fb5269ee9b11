namespace Foldwise.Core.Events;

/// <summary>This worker lost its cluster and joins again.</summary>
public sealed record WorkerLostCluster(string Reason) : SearchEvent;
