using Foldwise.Core.Definition;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Search;

/// <summary>
/// What a slot trains a trial with: its parameters with a short rung's learning rate, its budget, and the fit seed
/// of its first candidate (promotions share it, so a longer fit grows the same trees). The coordinator leases trials
/// with it and the kept models are re-fitted with it (<see cref="Refit"/>), so both fit the same thing.
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

    /// <summary>
    /// The fit that reproduces a done trial whole: a trial that stopped at its best round (<see cref="TrialRecord.BestRound"/>)
    /// predicted from that many rounds, which is the fit of that budget (a longer fit's first rounds are that fit's
    /// rounds; pinned by NativeStoppingTests). Trained whole, without stopping, at least one round.
    /// </summary>
    public static TrialFit Refit(TrialRecord trial, IReadOnlyDictionary<int, TrialRecord> trials, SearchDefinition definition)
    {
        var fit = For(trial, trials, definition);
        return trial.BestRound is { } best ? fit with { Budget = Math.Max(1, best) } : fit;
    }
}
