using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise export</c>.</summary>
public sealed class ExportSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder.")]
    public string Store { get; init; } = "";

    [CommandOption("--oof <FILE>")]
    [Description("Write the out-of-fold predictions here: id, target, then one column per done full-budget trial (original scale).")]
    public string? Oof { get; init; }

    public override ValidationResult Validate() =>
        string.IsNullOrWhiteSpace(Oof) ? ValidationResult.Error("--oof FILE is required") : ValidationResult.Success();
}
