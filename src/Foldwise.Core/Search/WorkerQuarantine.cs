using System.Collections.Immutable;

namespace Foldwise.Core.Search;

/// <summary>
/// Counts each worker's failed trials in a row. A worker reaching the limit while another worker has finished trials
/// is quarantined for the session: the fault is then the machine's, not the trials'. When every worker fails, nobody
/// is quarantined and the trials fail on their attempt limit as before.
/// </summary>
internal sealed class WorkerQuarantine(int failuresInARow)
{
    private readonly Dictionary<string, int> streaks = [];
    private readonly HashSet<string> succeeded = [];
    private readonly SortedDictionary<string, string> quarantined = [];

    public void Succeeded(string worker)
    {
        streaks[worker] = 0;
        succeeded.Add(worker);
    }

    public void Failed(string worker, string reason)
    {
        int streak = streaks[worker] = streaks.GetValueOrDefault(worker) + 1;
        if (streak >= failuresInARow && succeeded.Any(w => w != worker) && !quarantined.ContainsKey(worker))
        {
            quarantined[worker] = $"{streak} trials failed in a row; last: {reason}";
        }
    }

    public string? Reason(string worker) => quarantined.GetValueOrDefault(worker);

    public ImmutableSortedDictionary<string, string> All() => quarantined.ToImmutableSortedDictionary();
}
