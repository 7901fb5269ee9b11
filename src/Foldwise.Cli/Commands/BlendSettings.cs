using System.ComponentModel;
using Foldwise.Core.Definition;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise blend</c>.</summary>
public sealed class BlendSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder.")]
    public string Store { get; init; } = "";

    [CommandOption("--mode <MODE>")]
    [Description("simplex (w ≥ 0, Σw = 1; the default), non_negative (w ≥ 0 only) or greedy (forward selection with replacement), spelled as blend.mode in a definition.")]
    public string? Mode { get; init; }

    [CommandOption("--pool <K>")]
    [Description("Blend the best K full-budget trials of each family. Default: the definition's (3).")]
    public int? Pool { get; init; }

    [CommandOption("--json")]
    [Description("Print the blend as JSON.")]
    public bool Json { get; init; }

    public BlendMode? ParsedMode => Mode is null ? null
        : DefinitionWords.TryBlendMode(Mode, out var mode) ? mode
        : throw new InvalidOperationException("unreachable: validated");

    public override ValidationResult Validate()
    {
        if (Mode is { } m && !DefinitionWords.TryBlendMode(m, out _))
        {
            string? renamed = RetiredNames.ReplacementOf(m);
            string hint = renamed is null ? "" : $" ('{m}' is a retired name; did you mean {renamed}?)";
            return ValidationResult.Error($"--mode '{m}' is not one of {string.Join(", ", DefinitionWords.BlendModes)}{hint}");
        }

        return Pool is < 1 ? ValidationResult.Error("--pool must be at least 1") : ValidationResult.Success();
    }
}
