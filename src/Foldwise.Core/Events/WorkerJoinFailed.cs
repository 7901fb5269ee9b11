namespace Foldwise.Core.Events;

/// <summary>An attempt to join failed; the worker tries again after <paramref name="RetryIn"/>.</summary>
public sealed record WorkerJoinFailed(string Join, int Attempt, string Reason, TimeSpan RetryIn) : SearchEvent;
