using System.ComponentModel;
using Foldwise.Core.Spaces;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise plan</c>; the budgets are in the family's budget unit (boosting rounds for LightGBM, the default family).</summary>
public sealed class PlanSettings : CommandSettings
{
    [CommandOption("--family <NAME>")]
    [Description("The family whose rungs to plan, in its own budget unit (rounds, trees, iterations, passes). Default lightgbm.")]
    public string Family { get; init; } = FamilyNames.LightGbm;

    [CommandOption("--first-rung <B0>")]
    [Description("Budget of the lowest rung, in the family's unit. Default: the family's own (25 rounds for lightgbm).")]
    public int? GivenFirstRung { get; init; }

    [CommandOption("--full-budget <B>")]
    [Description("Budget a candidate is scored at when it reaches the top, in the family's unit. Default: the family's own (400 rounds for lightgbm).")]
    public int? GivenFullBudget { get; init; }

    /// <summary>The family planned; valid after <see cref="Validate"/>.</summary>
    public FamilyDescriptor Descriptor => FamilyDescriptors.Get(Family);

    public int FirstRung => GivenFirstRung ?? Descriptor.FirstRung;

    public int FullBudget => GivenFullBudget ?? Descriptor.FullBudget;

    [CommandOption("--eta <E>")]
    [Description("Keep one in E at each rung. Default 3.")]
    public int Eta { get; init; } = 3;

    [CommandOption("--screen-folds <N>")]
    [Description("Also plan ASHA rungs that count folds (schedule.screen_folds): a new candidate trains the full budget on the first N folds.")]
    public int? ScreenFolds { get; init; }

    [CommandOption("--folds <K>")]
    [Description("K of the K-fold plan, the top rung of a fold screen. Default 5.")]
    public int Folds { get; init; } = 5;

    [CommandOption("--json")]
    [Description("Print the plan as JSON.")]
    public bool Json { get; init; }

    [CommandOption("--min-budget <B0>", IsHidden = true)]
    public string? RetiredFirstRung { get; init; }

    [CommandOption("--max-budget <B>", IsHidden = true)]
    public string? RetiredFullBudget { get; init; }

    public override ValidationResult Validate()
    {
        if (RetiredFirstRung is not null)
        {
            return RetiredOption.Refuse("--min-budget");
        }

        if (RetiredFullBudget is not null)
        {
            return RetiredOption.Refuse("--max-budget");
        }

        if (ScreenFolds is { } screen && (screen < 1 || screen >= Folds))
        {
            return ValidationResult.Error($"--screen-folds must be at least 1 and below the plan's {Folds} folds (--folds), got {screen}");
        }

        if (FamilyDescriptors.Find(Family) is null)
        {
            return ValidationResult.Error($"--family must be one of {string.Join(", ", FamilyNames.All)}, got '{Family}'");
        }

        if (FirstRung < 1)
        {
            return ValidationResult.Error("--first-rung must be at least 1");
        }

        if (FullBudget < FirstRung)
        {
            return ValidationResult.Error("--full-budget must be at least --first-rung");
        }

        return Eta < 2 ? ValidationResult.Error("--eta must be at least 2") : ValidationResult.Success();
    }
}
