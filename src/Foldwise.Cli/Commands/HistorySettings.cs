using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise history</c>.</summary>
public sealed class HistorySettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder.")]
    public string Store { get; init; } = "";

    [CommandOption("--json")]
    [Description("Print the trials as JSON instead of a table.")]
    public bool Json { get; init; }

    [CommandOption("--wide")]
    [Description("Add each trial's parameters to the table.")]
    public bool Wide { get; init; }

    [CommandOption("--family <NAME>")]
    [Description("Only this family's trials.")]
    public string? Family { get; init; }

    [CommandOption("--rung <K>")]
    [Description("Only trials at this rung.")]
    public int? Rung { get; init; }

    [CommandOption("--state <STATE>")]
    [Description("Only trials in this state: queued, running, done or failed.")]
    public string? State { get; init; }

    [CommandOption("--top <N>")]
    [Description("Only the first N rows.")]
    public int? Top { get; init; }

    public override ValidationResult Validate()
    {
        if (State is { } s && !Enum.TryParse<Core.Search.TrialState>(s, ignoreCase: true, out _))
        {
            return ValidationResult.Error($"--state '{s}' is not one of queued, running, done, failed");
        }

        return Top is < 1 ? ValidationResult.Error("--top must be at least 1") : ValidationResult.Success();
    }
}
