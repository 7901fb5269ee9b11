using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise report</c>.</summary>
public sealed class ReportSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder.")]
    public string Store { get; init; } = "";

    [CommandOption("--out <FILE>")]
    [Description("The HTML file to write (replaced whole, never half-written).")]
    public string Out { get; init; } = "";

    public override ValidationResult Validate() =>
        string.IsNullOrWhiteSpace(Out) ? ValidationResult.Error("--out FILE.html is required") : ValidationResult.Success();
}
