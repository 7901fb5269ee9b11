using Foldwise.Core.Spaces;

namespace Foldwise.Core.Search;

/// <summary>
/// What a schedule asks the coordinator to run next: a candidate of a family at a budget.
/// A promotion names the trial it continues (<see cref="ParentId"/>) and carries its parameters.
/// </summary>
/// <param name="Rung">0 for a new candidate; k for the k-th promotion.</param>
/// <param name="Bracket">The Hyperband bracket, or 0 outside Hyperband.</param>
/// <param name="Proposer">Who chose the parameters: e.g. <c>random</c>, <c>tpe</c>, <c>promotion</c>.</param>
/// <param name="Folds">The plan's first folds the trial trains when a schedule screens on folds (<see cref="TrialRecord.Folds"/>); 0: all.</param>
public sealed record TrialPlan(string Family, ParameterSet Parameters, int Budget, int Rung, int? ParentId, string Proposer, int Bracket = 0, int Folds = 0)
{
    /// <summary>The queued trial that carries out this plan.</summary>
    public TrialRecord ToTrial(int id, DateTimeOffset created) => new()
    {
        Id = id,
        Family = Family,
        Parameters = Parameters,
        Budget = Budget,
        Rung = Rung,
        ParentId = ParentId,
        Proposer = Proposer,
        Bracket = Bracket,
        Folds = Folds,
        Created = created,
    };
}
