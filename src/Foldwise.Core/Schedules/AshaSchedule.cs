using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>
/// Asynchronous successive halving (Li et al., MLSys 2020). Rungs sit at <see cref="RungBudgets"/>; each family has
/// its own rungs. Asked for a plan, it scans rungs from the top down and promotes the first result that is in the
/// top ⌊n_k/η⌋ of its rung and not yet promoted (families in definition order within a rung); when nothing can be
/// promoted it starts a new candidate at rung 0 for the family whose turn it is. It never waits and never runs out.
/// With more than one bracket (<see cref="AshaBrackets"/>) a new candidate starts at its bracket's first rung, and
/// promotions rank it only against candidates of its own bracket; trials carry the bracket as 1, 2, … (0 when
/// there is one).
/// </summary>
public sealed class AshaSchedule : ISchedule
{
    private readonly CandidateSource _source;
    private readonly ImmutableArray<int> _budgets;
    private readonly int _eta;
    private readonly AshaBrackets _brackets;

    /// <summary>[bracket][family][rung]; a bracket's rungs below its first stay empty.</summary>
    private readonly AshaRung[][][] _rungs;

    /// <summary>[family][bracket]: new candidates started.</summary>
    private readonly int[][] _started;

    public AshaSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed)
    {
        _budgets = RungBudgets.For(options.FirstRung, options.FullBudget, options.Eta);
        _eta = options.Eta;
        _source = new CandidateSource(families, proposer, seed);
        _brackets = AshaBrackets.For(_budgets, _eta, options.Brackets);
        _rungs = [.. Enumerable.Range(0, _brackets.Count).Select(_ => Enumerable.Range(0, _source.Count)
            .Select(_ => Enumerable.Range(0, _budgets.Length).Select(_ => new AshaRung()).ToArray()).ToArray())];
        _started = [.. Enumerable.Range(0, _source.Count).Select(_ => new int[_brackets.Count])];
    }

    public ImmutableArray<int> Budgets => _budgets;

    public bool Exhausted => false;

    public void Observe(TrialRecord trial)
    {
        var (family, change) = _source.Observe(trial);
        // Bracket 0 on a trial means plain ASHA (one bracket, or a store written before brackets): the first bracket.
        int bracket = trial.Bracket <= 1 ? 0 : trial.Bracket - 1;
        if (family < 0 || bracket >= _brackets.Count || trial.Rung < bracket || trial.Rung >= _budgets.Length)
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
        for (int k = _budgets.Length - 2; k >= 0; k--)
        {
            for (int b = 0; b < _brackets.Count && b <= k; b++)
            {
                for (int f = 0; f < _source.Count; f++)
                {
                    if (_rungs[b][f][k].TryPromotable(_eta, out int parent, out var parameters))
                    {
                        return new TrialPlan(_source[f].Family, parameters, _budgets[k + 1], k + 1, parent, Promotion.ProposerName, BracketLabel(b));
                    }
                }
            }
        }

        int family = _source.NextFamily();
        int start = _brackets.Next(_started[family]);
        return _source.NewCandidate(family, _budgets[start], BracketLabel(start), rung: start);
    }

    private int BracketLabel(int bracket) => _brackets.Count == 1 ? 0 : bracket + 1;
}
