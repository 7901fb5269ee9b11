using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise predict</c>.</summary>
public sealed class PredictSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder; its kept models (OUT/models) score the rows.")]
    public string Store { get; init; } = "";

    [CommandOption("--rows <FILE>")]
    [Description("A CSV table of new rows: the id column and every training feature the search kept (other columns are ignored).")]
    public string? Rows { get; init; }

    [CommandOption("--out <FILE>")]
    [Description("Write the predictions here, under the search's prediction header (<id>,predicted_<target>).")]
    public string? Out { get; init; }

    [CommandOption("--threads <N>")]
    [Description("Threads LightGBM may use to predict. Default: every core.")]
    public int? Threads { get; init; }

    public override ValidationResult Validate()
    {
        if (string.IsNullOrWhiteSpace(Rows))
        {
            return ValidationResult.Error("--rows FILE is required");
        }

        if (string.IsNullOrWhiteSpace(Out))
        {
            return ValidationResult.Error("--out FILE is required");
        }

        return Threads is < 1 ? ValidationResult.Error("--threads must be at least 1") : ValidationResult.Success();
    }
}
