using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise demo</c>.</summary>
public sealed class DemoSettings : SearchHostSettings
{
    [CommandOption("--out <DIR>")]
    [Description("Folder for the demo tables, its definition and the search. Required.")]
    public string Out { get; init; } = "";

    [CommandOption("--quick")]
    [Description("A small table and few trials: the whole run takes a minute or two on 2 cores.")]
    public bool Quick { get; init; }

    [CommandOption("--data-only")]
    [Description("Only write the tables and search.json (e.g. for configs/demo.json); run nothing.")]
    public bool DataOnly { get; init; }

    [CommandOption("--seed <N>")]
    [Description("Seed of the invented data and of the search. Default 7.")]
    public int Seed { get; init; } = 7;

    public override ValidationResult Validate() =>
        string.IsNullOrWhiteSpace(Out) ? ValidationResult.Error("--out DIR is required: the folder for the demo") : base.Validate();
}
