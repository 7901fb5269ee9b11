using Foldwise.Core.Schedules;

namespace Foldwise.Core.Definition;

/// <summary>
/// The schedule of a search. Budgets are boosting rounds; rungs sit at MinBudget·Eta^k up to MaxBudget.
/// Defaults: ASHA with TPE, 25 to 400 rounds, η = 3, short rungs at the learning rate × √(MaxBudget / budget).
/// </summary>
/// <param name="RateScaling">The exponent of <see cref="Schedules.ShortRungRate"/>: 1 scales a short rung's learning rate by MaxBudget / budget, 0 runs it as drawn; the default is 0.5.</param>
/// <param name="Brackets">ASHA only: how many brackets of asynchronous Hyperband (<see cref="Schedules.AshaBrackets"/>); 1 is plain ASHA.</param>
public sealed record ScheduleOptions(
    ScheduleKind Kind = ScheduleKind.Asha,
    ProposerKind Proposer = ProposerKind.Tpe,
    int MinBudget = 25,
    int MaxBudget = 400,
    int Eta = 3,
    double RateScaling = 0.5,
    int Brackets = 1)
{
    /// <summary>The learning-rate rule for trials below MaxBudget.</summary>
    public ShortRungRate ShortRungRate => new(RateScaling);
}
