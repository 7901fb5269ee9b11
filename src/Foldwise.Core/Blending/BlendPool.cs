using Foldwise.Core.Search;

namespace Foldwise.Core.Blending;

/// <summary>Chooses which trials the blend may weight: the best few full-budget trials of each family.</summary>
public static class BlendPool
{
    /// <summary>
    /// The top <paramref name="perFamily"/> done trials of each family whose budget is
    /// <paramref name="fullBudget"/>, best score first (lower is better), ties to the lower id.
    /// Families come in ordinal name order; a done trial without a finite score is left out.
    /// </summary>
    public static IReadOnlyList<TrialRecord> Select(IEnumerable<TrialRecord> trials, int perFamily, int fullBudget) =>
        Select(trials, perFamily, _ => fullBudget);

    /// <summary>The same with each family's own full budget (<see cref="Definition.SearchDefinition.BudgetOf"/>).</summary>
    public static IReadOnlyList<TrialRecord> Select(IEnumerable<TrialRecord> trials, int perFamily, Func<string, int> fullBudgetOf)
    {
        ArgumentNullException.ThrowIfNull(fullBudgetOf);
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentOutOfRangeException.ThrowIfLessThan(perFamily, 1);
        return
        [
            .. trials
                .Where(t => t.State == TrialState.Done && t.AllFolds && t.Budget == fullBudgetOf(t.Family) && t.Score is { } s && double.IsFinite(s))
                .GroupBy(t => t.Family, StringComparer.Ordinal)
                .OrderBy(g => g.Key, StringComparer.Ordinal)
                .SelectMany(g => g.OrderBy(t => t.Score!.Value).ThenBy(t => t.Id).Take(perFamily)),
        ];
    }
}
