namespace Foldwise.Core.Search;

/// <summary>
/// A trial's life: <c>Queued → Running → Done | Failed</c>, and <c>Running → Queued</c> again when its lease is lost.
/// </summary>
public enum TrialState
{
    Queued,
    Running,
    Done,
    Failed,
}
