namespace Foldwise.Core.Events;

/// <summary>A silo joined or left the cluster, as one readable sentence.</summary>
public sealed record ClusterChanged(string Change) : SearchEvent;
