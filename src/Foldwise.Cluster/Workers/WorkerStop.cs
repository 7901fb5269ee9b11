namespace Foldwise.Cluster.Workers;

/// <summary>
/// A worker's own reason to leave the cluster, set by its slots: the coordinator refused it (another build), or no
/// family trains on this machine. The worker host reads it and exits with that line instead of joining again.
/// </summary>
public sealed class WorkerStop
{
    private string? reason;

    /// <summary>Null while the worker may keep working.</summary>
    public string? Reason => Volatile.Read(ref reason);

    public void Request(string line) => Interlocked.CompareExchange(ref reason, line, null);
}
