using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise run</c>: a definition file, or flags standing in for one, and where the search is kept.</summary>
public sealed class RunSettings : SearchHostSettings
{
    [CommandArgument(0, "[DEFINITION]")]
    [Description("Search definition (JSON). Leave out to describe the search with --train, --test, --id and --target.")]
    public string? Definition { get; init; }

    [CommandOption("--train <CSV>")]
    [Description("Training table (CSV with a header).")]
    public string? Train { get; init; }

    [CommandOption("--test <CSV>")]
    [Description("Test table to predict (CSV with a header).")]
    public string? Test { get; init; }

    [CommandOption("--id <COLUMN>")]
    [Description("The row-id column of both tables.")]
    public string? Id { get; init; }

    [CommandOption("--target <COLUMN>")]
    [Description("The training table's target column.")]
    public string? Target { get; init; }

    [CommandOption("--trials <N>")]
    [Description("Stop after this many trials (overrides the definition's budget).")]
    public int? Trials { get; init; }

    [CommandOption("--hours <H>")]
    [Description("Stop creating trials after this many hours of wall clock (overrides the definition's budget).")]
    public double? Hours { get; init; }

    [CommandOption("--out <DIR>")]
    [Description("Folder for the store (search.db), the prediction file and the cached tables. Required.")]
    public string Out { get; init; } = "";

    public override ValidationResult Validate()
    {
        if (string.IsNullOrWhiteSpace(Out))
        {
            return ValidationResult.Error("--out DIR is required: the folder where the search is kept");
        }

        if (Definition is null && (Train is null || Test is null || Id is null || Target is null))
        {
            return ValidationResult.Error("give a definition file, or all of --train, --test, --id and --target");
        }

        if (Trials is < 1)
        {
            return ValidationResult.Error("--trials must be at least 1");
        }

        return Hours is <= 0 ? ValidationResult.Error("--hours must be more than 0") : base.Validate();
    }
}
