namespace Foldwise.Core.Events;

/// <summary>Nothing answers on the coordinator's silo port yet (it has not started, or is restarting); the worker looks again every <paramref name="RetryIn"/>.</summary>
public sealed record WorkerAwaitsCoordinator(string Join, TimeSpan RetryIn) : SearchEvent;
