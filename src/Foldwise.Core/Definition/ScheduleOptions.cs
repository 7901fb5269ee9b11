using Foldwise.Core.Schedules;

namespace Foldwise.Core.Definition;

/// <summary>
/// The schedule of a search. Budgets are in the learners' budget unit (boosting rounds for the built-in families);
/// rungs sit at FirstRung·Eta^k up to FullBudget, the budget a candidate is scored at when it reaches the top.
/// Defaults: ASHA with TPE, 25 to 400 rounds, η = 3, short rungs at the learning rate × √(FullBudget / budget).
/// </summary>
/// <param name="RateScaling">The exponent of <see cref="Schedules.ShortRungRate"/>: 1 scales a short rung's learning rate by FullBudget / budget, 0 runs it as drawn; the default is 0.5.</param>
/// <param name="Brackets">ASHA only: how many brackets of asynchronous Hyperband (<see cref="Schedules.AshaBrackets"/>); 1 is plain ASHA.</param>
/// <param name="ScreenFolds">
/// ASHA only. 0: rungs count the family's budget (rounds). n: rungs count folds instead (racing over folds): every trial
/// trains the family's full budget at its drawn learning rate, a new candidate on the plan's first n folds only, and
/// rungs sit at n·Eta^k folds up to all of them, so candidates at a rung are compared on the same rows.
/// </param>
public sealed record ScheduleOptions(
    ScheduleKind Kind = ScheduleKind.Asha,
    ProposerKind Proposer = ProposerKind.Tpe,
    int FirstRung = 25,
    int FullBudget = 400,
    int Eta = 3,
    double RateScaling = 0.5,
    int Brackets = 1,
    int ScreenFolds = 0)
{
    /// <summary>True when rungs count folds (<see cref="ScreenFolds"/>) rather than the family's budget.</summary>
    public bool ByFolds => ScreenFolds > 0;

    /// <summary>The learning-rate rule for trials below FullBudget.</summary>
    public ShortRungRate ShortRungRate => new(RateScaling);
}
