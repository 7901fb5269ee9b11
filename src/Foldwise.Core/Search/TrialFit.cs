using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Search;

/// <summary>
/// What a slot trains a trial with: its parameters with a short rung's learning rate, its budget, and the fit seed
/// of its first candidate (promotions share it, so a longer fit grows the same trees). The coordinator leases trials
/// with it and the kept models are re-fitted with it, so both fit the same thing.
/// </summary>
public sealed record TrialFit(ParameterSet Run, int Budget, int Seed)
{
    public static TrialFit For(TrialRecord trial, IReadOnlyDictionary<int, TrialRecord> trials, SearchDefinition definition)
    {
        ArgumentNullException.ThrowIfNull(trial);
        ArgumentNullException.ThrowIfNull(trials);
        ArgumentNullException.ThrowIfNull(definition);
        var root = trial;
        while (root.ParentId is { } parent && trials.TryGetValue(parent, out var up))
        {
            root = up;
        }

        var run = definition.Schedule.ShortRungRate.For(trial.Parameters, trial.Budget, definition.BudgetOf(trial.Family).FullBudget);
        return new TrialFit(run, trial.Budget, new SearchSeeds(definition.Seed).Trial(root.Id));
    }
}
