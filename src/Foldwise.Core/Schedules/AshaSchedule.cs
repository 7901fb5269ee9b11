using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>
/// Asynchronous successive halving (Li et al., MLSys 2020). Rungs sit at <see cref="RungBudgets"/>; each family has
/// its own rungs, in its own budget unit (<see cref="FamilySearch.BudgetUnder"/>). Asked for a plan, it scans rungs from the top down and promotes the first result that is in the
/// top ⌊n_k/η⌋ of its rung and not yet promoted (families in definition order within a rung); when nothing can be
/// promoted it starts a new candidate at rung 0 for the family whose turn it is. It never waits and never runs out.
/// With more than one bracket (<see cref="AshaBrackets"/>) a new candidate starts at its bracket's first rung, and
/// promotions rank it only against candidates of its own bracket; trials carry the bracket as 1, 2, … (0 when
/// there is one). When the schedule screens on folds (<see cref="ScheduleOptions.ScreenFolds"/>) the rungs count
/// folds instead: every trial trains the family's full budget, on the plan's first rung-many folds.
/// </summary>
public sealed class AshaSchedule : ISchedule
{
    private readonly CandidateSource _source;
    /// <summary>[family]: the family's rungs, in its budget unit, or in folds when screening on folds.</summary>
    private readonly ImmutableArray<int>[] _budgets;

    /// <summary>[family]: the budget every trial trains when screening on folds.</summary>
    private readonly int[] _fullBudgets;

    /// <summary>0, or the fold count when rungs count folds.</summary>
    private readonly int _foldCount;
    private readonly int _eta;

    /// <summary>[family]: the family's brackets (as many for every family; their costs follow the family's rungs).</summary>
    private readonly AshaBrackets[] _brackets;
    private readonly int _bracketCount;

    /// <summary>[bracket][family][rung]; a bracket's rungs below its first stay empty.</summary>
    private readonly AshaRung[][][] _rungs;

    /// <summary>[family][bracket]: new candidates started.</summary>
    private readonly int[][] _started;

    /// <param name="folds">The search's fold count: the top rung when the schedule screens on folds.</param>
    public AshaSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed, int folds = 5)
    {
        ArgumentNullException.ThrowIfNull(options);
        ScheduleChecks.ValidateScreen(options, folds);

        _fullBudgets = [.. families.Select(f => f.BudgetUnder(options).FullBudget)];
        _foldCount = options.ByFolds ? folds : 0;
        _budgets = options.ByFolds
            ? [.. families.Select(_ => RungBudgets.For(options.ScreenFolds, folds, options.Eta))]
            : [.. families.Select(f => f.BudgetUnder(options)).Select(b => RungBudgets.For(b.FirstRung, b.FullBudget, options.Eta))];
        _eta = options.Eta;
        _source = new CandidateSource(families, proposer, seed);
        _brackets = [.. _budgets.Select(b => AshaBrackets.For(b, _eta, options.Brackets))];
        _bracketCount = options.Brackets;
        _rungs = [.. Enumerable.Range(0, _bracketCount).Select(_ => Enumerable.Range(0, _source.Count)
            .Select(f => Enumerable.Range(0, _budgets[f].Length).Select(_ => new AshaRung()).ToArray()).ToArray())];
        _started = [.. Enumerable.Range(0, _source.Count).Select(_ => new int[_bracketCount])];
    }

    /// <summary>A family's rungs (budgets, or folds when screening on folds), by its place in the definition.</summary>
    public ImmutableArray<int> BudgetsOf(int family) => _budgets[family];

    public bool Exhausted => false;

    public void Observe(TrialRecord trial)
    {
        var (family, change) = _source.Observe(trial);
        // Bracket 0 on a trial means plain ASHA (one bracket, or a store written before brackets): the first bracket.
        int bracket = trial.Bracket <= 1 ? 0 : trial.Bracket - 1;
        if (family < 0 || bracket >= _bracketCount || trial.Rung < bracket || trial.Rung >= _budgets[family].Length)
        {
            return;
        }

        var rungs = _rungs[bracket][family];
        if (change.Created && trial.ParentId is null)
        {
            _started[family][bracket]++;
        }

        if (change.Created && trial.ParentId is int parent && trial.Rung > bracket)
        {
            rungs[trial.Rung - 1].MarkPromoted(parent);
        }

        if (change.Finished && trial.State == TrialState.Done && trial.Score is double score && double.IsFinite(score))
        {
            rungs[trial.Rung].Add(trial.Id, score, trial.Parameters);
        }
    }

    public TrialPlan? NextPlan()
    {
        int top = _budgets.Max(b => b.Length);
        for (int k = top - 2; k >= 0; k--)
        {
            for (int b = 0; b < _bracketCount && b <= k; b++)
            {
                for (int f = 0; f < _source.Count; f++)
                {
                    if (k < _budgets[f].Length - 1 && _rungs[b][f][k].TryPromotable(_eta, out int parent, out var parameters))
                    {
                        return new TrialPlan(_source[f].Family, parameters, BudgetAt(f, k + 1), k + 1, parent, Promotion.ProposerName, BracketLabel(b), FoldsAt(f, k + 1));
                    }
                }
            }
        }

        int family = _source.NextFamily();
        int start = _brackets[family].Next(_started[family]);
        return _source.NewCandidate(family, BudgetAt(family, start), BracketLabel(start), rung: start, folds: FoldsAt(family, start));
    }

    private int BudgetAt(int family, int rung) => RungBudgets.Training(_budgets[family][rung], _fullBudgets[family], _foldCount).Budget;

    /// <summary>0 (all folds) unless screening on folds below the top rung.</summary>
    private int FoldsAt(int family, int rung) => RungBudgets.Training(_budgets[family][rung], _fullBudgets[family], _foldCount).Folds;

    private int BracketLabel(int bracket) => _bracketCount == 1 ? 0 : bracket + 1;
}
