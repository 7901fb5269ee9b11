using Foldwise.Cluster.Contracts;

namespace Foldwise.Cluster.Hosting;

/// <summary>
/// Who may work for a coordinator: a worker of exactly the coordinator's build (version and commit), since trials,
/// parameters and stored results are only comparable between the same learners and code, offering at least one family.
/// </summary>
public static class JoinRule
{
    /// <summary>Null admits the worker; otherwise one line naming both versions (or what is missing).</summary>
    public static string? Refusal(WorkerHello hello, string coordinatorVersion)
    {
        if (!string.Equals(hello.Version, coordinatorVersion, StringComparison.Ordinal))
        {
            return $"worker {hello.Worker} runs Foldwise {hello.Version} but the coordinator runs Foldwise {coordinatorVersion}; install {coordinatorVersion} on the worker";
        }

        return hello.Families.Length == 0 ? $"worker {hello.Worker} offers no family it can train" : null;
    }
}
