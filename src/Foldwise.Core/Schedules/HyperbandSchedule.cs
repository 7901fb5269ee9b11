using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>
/// Hyperband (Li et al., JMLR 18(185), 2018): the brackets of <see cref="HyperbandPlan"/> one after another, each
/// run as synchronous successive halving, and from the first bracket again after the last. Every family runs its
/// own copy of the current bracket (its own n_i trials per rung, promotions by merit within the family); the next
/// bracket starts when every family's copy is complete. Trials carry the bracket's ordinal (1, 2, … counting across
/// cycles, so 0 still means "not Hyperband"). While a rung is still running and nothing else can start, the next
/// plan is null. When the schedule screens on folds (<see cref="ScheduleOptions.ScreenFolds"/>) the brackets count folds
/// instead, from the screen's folds up to all of them: every trial trains the family's full budget, on the plan's first
/// rung-many folds.
/// </summary>
public sealed class HyperbandSchedule : ISchedule
{
    private readonly CandidateSource _source;
    /// <summary>[family]: the family's brackets over its own rungs.</summary>
    private readonly HyperbandPlan[] _plans;
    private readonly Dictionary<int, BracketRun[]> _runs = [];

    /// <summary>[family]: the budget every trial trains when the brackets count folds.</summary>
    private readonly int[] _fullBudgets;

    /// <summary>0, or the fold count when the brackets count folds.</summary>
    private readonly int _foldCount;
    private int _current = 1;

    /// <param name="folds">The search's fold count: the top rung when the schedule screens on folds.</param>
    public HyperbandSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed, int folds = 5)
    {
        ArgumentNullException.ThrowIfNull(options);
        ScheduleChecks.ValidateScreen(options, folds);

        _foldCount = options.ByFolds ? folds : 0;
        _fullBudgets = [.. families.Select(f => f.BudgetUnder(options).FullBudget)];
        _plans = options.ByFolds
            ? [.. families.Select(_ => HyperbandPlan.For(options.ScreenFolds, folds, options.Eta))]
            : [.. families.Select(f => f.BudgetUnder(options)).Select(b => HyperbandPlan.For(b.FirstRung, b.FullBudget, options.Eta))];
        _source = new CandidateSource(families, proposer, seed);
    }

    public bool Exhausted => false;

    /// <summary>The bracket of a trial ordinal: 1 → s_max, 2 → s_max − 1, …, wrapping after s = 0.</summary>
    /// <summary>The bracket the first family runs as bracket <paramref name="ordinal"/>.</summary>
    public HyperbandBracket BracketOf(int ordinal) => BracketOf(0, ordinal);

    /// <summary>The bracket <paramref name="family"/> (its place in the definition) runs as bracket <paramref name="ordinal"/>: each family cycles through its own plan.</summary>
    public HyperbandBracket BracketOf(int family, int ordinal) => _plans[family].Brackets[(ordinal - 1) % _plans[family].Brackets.Length];

    public void Observe(TrialRecord trial)
    {
        var (family, change) = _source.Observe(trial);
        if (family < 0 || trial.Bracket < 1)
        {
            return;
        }

        RunsOf(trial.Bracket)[family].Observe(trial, change);
        _current = Math.Max(_current, trial.Bracket);
    }

    public TrialPlan? NextPlan()
    {
        // At most two passes: the current bracket, then (when every family completed it) the next one.
        for (int ordinal = _current; ordinal <= _current + 1; ordinal++)
        {
            var runs = RunsOf(ordinal);
            int chosen = -1;
            BracketStep chosenStep = default;
            bool waiting = false;
            for (int f = 0; f < runs.Length; f++)
            {
                var step = runs[f].Next();
                if (step.Kind is BracketStepKind.New or BracketStepKind.Promote)
                {
                    if (chosen < 0 || runs[f].Created < runs[chosen].Created)
                    {
                        (chosen, chosenStep) = (f, step);
                    }
                }
                else if (step.Kind == BracketStepKind.Waiting)
                {
                    waiting = true;
                }
            }

            if (chosen >= 0)
            {
                var (budget, folds) = RungBudgets.Training(chosenStep.Budget, _fullBudgets[chosen], _foldCount);
                return chosenStep.Kind == BracketStepKind.New
                    ? _source.NewCandidate(chosen, budget, ordinal, rung: 0, folds: folds)
                    : new TrialPlan(_source[chosen].Family, chosenStep.Parameters!, budget, chosenStep.Rung, chosenStep.Parent, Promotion.ProposerName, ordinal, folds);
            }

            if (waiting)
            {
                return null;
            }
        }

        return null;
    }

    private BracketRun[] RunsOf(int ordinal)
    {
        if (!_runs.TryGetValue(ordinal, out var runs))
        {
            runs = new BracketRun[_source.Count];
            for (int f = 0; f < runs.Length; f++)
            {
                runs[f] = new BracketRun(BracketOf(f, ordinal));
            }

            _runs.Add(ordinal, runs);
        }

        return runs;
    }
}
