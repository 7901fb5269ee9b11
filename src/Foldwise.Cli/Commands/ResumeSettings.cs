using System.ComponentModel;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>Options of <c>foldwise resume</c>: the store to continue, its local slots, and whether a finished search blends again.</summary>
public sealed class ResumeSettings : SearchHostSettings
{
    [CommandArgument(0, "<STORE>")]
    [Description("The search's store (OUT/search.db), or its folder OUT.")]
    public string Store { get; init; } = "";

    [CommandOption("--blend")]
    [Description("For a search that finished already: solve the blend again and rewrite predictions.csv. Without it, a finished search is left as it is.")]
    public bool Blend { get; init; }

    public override ValidationResult Validate() =>
        string.IsNullOrWhiteSpace(Store) ? ValidationResult.Error("give the search's store (OUT/search.db) or its folder") : base.Validate();
}
