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
    private readonly int _budget;

    public FullBudgetSchedule(ImmutableArray<FamilySearch> families, ScheduleOptions options, IProposer proposer, int seed)
    {
        ScheduleChecks.Validate(options);
        _source = new CandidateSource(families, proposer, seed);
        _budget = options.FullBudget;
    }

    public bool Exhausted => false;

    public void Observe(TrialRecord trial) => _source.Observe(trial);

    public TrialPlan? NextPlan() => _source.NewCandidate(_source.NextFamily(), _budget);
}
