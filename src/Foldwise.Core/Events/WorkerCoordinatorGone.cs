namespace Foldwise.Core.Events;

/// <summary>After its search finished, the coordinator stopped answering: expected (it ran one search), not a fault.</summary>
public sealed record WorkerCoordinatorGone(string FinishedSearchId) : SearchEvent;
