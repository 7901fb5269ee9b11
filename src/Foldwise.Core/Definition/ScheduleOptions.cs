namespace Foldwise.Core.Definition;

/// <summary>
/// The schedule of a search. Budgets are boosting rounds; rungs sit at MinBudget·Eta^k up to MaxBudget.
/// Defaults: ASHA with TPE, 25 to 400 rounds, η = 3.
/// </summary>
public sealed record ScheduleOptions(
    ScheduleKind Kind = ScheduleKind.Asha,
    ProposerKind Proposer = ProposerKind.Tpe,
    int MinBudget = 25,
    int MaxBudget = 400,
    int Eta = 3);
