using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise plan</c>.</summary>
public sealed class PlanSettings : CommandSettings
{
    [CommandOption("--min-budget <R0>")]
    [Description("Rounds of the smallest rung. Default 25.")]
    public int MinBudget { get; init; } = 25;

    [CommandOption("--max-budget <R>")]
    [Description("Rounds of the full budget. Default 400.")]
    public int MaxBudget { get; init; } = 400;

    [CommandOption("--eta <E>")]
    [Description("Keep one in E at each rung. Default 3.")]
    public int Eta { get; init; } = 3;

    [CommandOption("--json")]
    [Description("Print the plan as JSON.")]
    public bool Json { get; init; }

    public override ValidationResult Validate()
    {
        if (MinBudget < 1)
        {
            return ValidationResult.Error("--min-budget must be at least 1");
        }

        if (MaxBudget < MinBudget)
        {
            return ValidationResult.Error("--max-budget must be at least --min-budget");
        }

        return Eta < 2 ? ValidationResult.Error("--eta must be at least 2") : ValidationResult.Success();
    }
}
