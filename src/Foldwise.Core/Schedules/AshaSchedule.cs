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
/// </summary>
public sealed class AshaSchedule : ISchedule
{
    private readonly CandidateSource _source;
    private readonly ImmutableArray<int> _budgets;
    private readonly int _eta;
    private readonly AshaRung[][] _rungs;

    public AshaSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed)
    {
        _budgets = RungBudgets.For(options.MinBudget, options.MaxBudget, options.Eta);
        _eta = options.Eta;
        _source = new CandidateSource(families, proposer, seed);
        _rungs = new AshaRung[_source.Count][];
        for (int f = 0; f < _rungs.Length; f++)
        {
            _rungs[f] = new AshaRung[_budgets.Length];
            for (int k = 0; k < _budgets.Length; k++)
            {
                _rungs[f][k] = new AshaRung();
            }
        }
    }

    public ImmutableArray<int> Budgets => _budgets;

    public bool Exhausted => false;

    public void Observe(TrialRecord trial)
    {
        var (family, change) = _source.Observe(trial);
        if (family < 0 || trial.Rung < 0 || trial.Rung >= _budgets.Length)
        {
            return;
        }

        var rungs = _rungs[family];
        if (change.Created && trial.ParentId is int parent && trial.Rung > 0)
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
            for (int f = 0; f < _rungs.Length; f++)
            {
                if (_rungs[f][k].TryPromotable(_eta, out int parent, out var parameters))
                {
                    return new TrialPlan(_source[f].Family, parameters, _budgets[k + 1], k + 1, parent, Promotion.ProposerName);
                }
            }
        }

        return _source.NewCandidate(_source.NextFamily(), _budgets[0]);
    }
}
