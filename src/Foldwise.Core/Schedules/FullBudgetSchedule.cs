using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>
/// Plain search: every plan is a new candidate at FullBudget (rung 0), families taking turns in definition order.
/// It never runs out; the coordinator's trial and hour budgets end it.
/// </summary>
public sealed class FullBudgetSchedule : ISchedule
{
    private readonly CandidateSource _source;
    /// <summary>[family]: its full budget.</summary>
    private readonly int[] _budgets;

    public FullBudgetSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed)
    {
        ScheduleChecks.Validate(options);
        _source = new CandidateSource(families, proposer, seed);
        _budgets = [.. families.Select(f => f.BudgetUnder(options).FullBudget)];
    }

    public bool Exhausted => false;

    public void Observe(TrialRecord trial) => _source.Observe(trial);

    public TrialPlan? NextPlan()
    {
        int family = _source.NextFamily();
        return _source.NewCandidate(family, _budgets[family]);
    }
}
