namespace Foldwise.Core.Events;

/// <summary>This worker joined the coordinator at <paramref name="Join"/>.</summary>
public sealed record WorkerJoined(string Join, string Name, int Slots, int Threads) : SearchEvent;
