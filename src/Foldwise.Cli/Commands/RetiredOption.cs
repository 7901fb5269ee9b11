using Foldwise.Core.Definition;
using Spectre.Console;

namespace Foldwise.Cli.Commands;

/// <summary>
/// Refuses an option an earlier version spelled differently, naming the option that replaced it. Settings keep
/// such options hidden, so a retired spelling meets this message rather than being taken as an unknown argument.
/// </summary>
internal static class RetiredOption
{
    public static ValidationResult Refuse(string option) =>
        ValidationResult.Error($"{option} is a retired name; did you mean {RetiredNames.ReplacementOf(option) ?? "another option"}?");
}
