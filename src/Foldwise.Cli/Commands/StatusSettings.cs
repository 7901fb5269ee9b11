using System.ComponentModel;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise status</c>.</summary>
public sealed class StatusSettings : CommandSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db) or its folder; readable while the search runs.")]
    public string Store { get; init; } = "";
}
