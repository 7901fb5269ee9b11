using Foldwise.Core.Search;

namespace Foldwise.Cli.Commands;

/// <summary>A trial's place in its promotion chain: the trials it continues, oldest last, and those that continue it.</summary>
public static class ShowLineage
{
    /// <summary>The trial, its parent, the parent's parent… (stops at a missing id or a loop).</summary>
    public static IReadOnlyList<TrialRecord> Chain(TrialRecord trial, IReadOnlyList<TrialRecord> all)
    {
        var byId = all.ToDictionary(t => t.Id);
        var chain = new List<TrialRecord> { trial };
        var seen = new HashSet<int> { trial.Id };
        while (chain[^1].ParentId is { } parent && seen.Add(parent) && byId.TryGetValue(parent, out var next))
        {
            chain.Add(next);
        }

        return chain;
    }

    public static IReadOnlyList<TrialRecord> Children(TrialRecord trial, IReadOnlyList<TrialRecord> all) =>
        [.. all.Where(t => t.ParentId == trial.Id).OrderBy(t => t.Id)];
}
