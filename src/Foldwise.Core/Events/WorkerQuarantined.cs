namespace Foldwise.Core.Events;

/// <summary>The coordinator leases no more trials of this search to <paramref name="Worker"/>: its trials kept failing while other machines finished theirs.</summary>
public sealed record WorkerQuarantined(string SearchId, string Worker, string Reason) : SearchEvent;
