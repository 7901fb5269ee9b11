using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise show</c>.</summary>
public sealed class ShowSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder.")]
    public string Store { get; init; } = "";

    [CommandArgument(1, "<TRIAL>")]
    [Description("The trial's id, as listed by 'foldwise history'.")]
    public int Trial { get; init; }

    [CommandOption("--json")]
    [Description("Print the trial as JSON instead of text.")]
    public bool Json { get; init; }

    public override ValidationResult Validate() =>
        Trial < 1 ? ValidationResult.Error("TRIAL must be a trial id (1 or more)") : ValidationResult.Success();
}
