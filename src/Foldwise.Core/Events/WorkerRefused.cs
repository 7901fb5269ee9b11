namespace Foldwise.Core.Events;

/// <summary>This worker cannot work for the cluster at <paramref name="Join"/> (another build, or no family trains here) and leaves.</summary>
public sealed record WorkerRefused(string Join, string Reason) : SearchEvent;
