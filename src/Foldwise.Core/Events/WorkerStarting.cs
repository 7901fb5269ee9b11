namespace Foldwise.Core.Events;

/// <summary>A worker process starts (again, after a fresh start) and will join <paramref name="Join"/> from <paramref name="Advertise"/>.</summary>
public sealed record WorkerStarting(string Name, string Join, string Advertise, bool MutualTls) : SearchEvent;
