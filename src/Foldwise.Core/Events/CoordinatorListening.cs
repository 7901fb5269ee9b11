namespace Foldwise.Core.Events;

/// <summary>A networked coordinator is reachable at this address; <paramref name="MutualTls"/> when a certificate guards it.</summary>
public sealed record CoordinatorListening(string Address, int Port, bool MutualTls) : SearchEvent;
