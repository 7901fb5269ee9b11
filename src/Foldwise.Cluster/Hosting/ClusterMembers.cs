namespace Foldwise.Cluster.Hosting;

/// <summary>The silos this silo currently sees as active, and a notice when one joins or leaves (for console lines).</summary>
public sealed class ClusterMembers
{
    private volatile string[] active = [];

    /// <summary>Active silos as "address (name)".</summary>
    public IReadOnlyList<string> Active => active;

    /// <summary>Raised with a human line, e.g. "joined: 10.0.0.7:11111 (office-pc-3)".</summary>
    public event Action<string>? Changed;

    internal void Update(string[] now, IEnumerable<string> lines)
    {
        active = now;
        foreach (string line in lines)
        {
            Changed?.Invoke(line);
        }
    }
}
