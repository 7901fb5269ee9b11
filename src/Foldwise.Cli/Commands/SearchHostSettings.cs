using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options shared by every command that hosts a coordinator: its local slots.</summary>
public class SearchHostSettings : CommandSettings
{
    [CommandOption("--slots <N>")]
    [Description("Local slots training trials. Default 1: ML.NET trains one LightGBM model per process at a time, so one slot with every core keeps the machine busiest.")]
    public int Slots { get; init; } = 1;

    [CommandOption("--threads <N>")]
    [Description("Threads per slot. Default: the machine's cores divided among the slots.")]
    public int? Threads { get; init; }

    public override ValidationResult Validate()
    {
        if (Slots < 0)
        {
            return ValidationResult.Error("--slots cannot be negative");
        }

        return Threads is < 1 ? ValidationResult.Error("--threads must be at least 1") : ValidationResult.Success();
    }
}
