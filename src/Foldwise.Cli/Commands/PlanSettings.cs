using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise plan</c>; the budgets are in the family's budget unit (boosting rounds for the built-in families).</summary>
public sealed class PlanSettings : CommandSettings
{
    [CommandOption("--first-rung <B0>")]
    [Description("Budget of the lowest rung (rounds). Default 25, as schedule.first_rung.")]
    public int FirstRung { get; init; } = 25;

    [CommandOption("--full-budget <B>")]
    [Description("Budget a candidate is scored at when it reaches the top (rounds). Default 400, as schedule.full_budget.")]
    public int FullBudget { get; init; } = 400;

    [CommandOption("--eta <E>")]
    [Description("Keep one in E at each rung. Default 3.")]
    public int Eta { get; init; } = 3;

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
