using Foldwise.Tuning;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise predict</c>: scores a table of new rows with the blend a search kept, without searching again.</summary>
public sealed class PredictCommand(IAnsiConsole console) : Command<PredictSettings>
{
    public override int Execute(CommandContext context, PredictSettings settings, CancellationToken cancellationToken)
    {
        var scored = KeptScoring.Predict(settings.Store, settings.Rows!, settings.Out!, settings.Threads ?? Environment.ProcessorCount);
        string members = string.Join(", ", scored.Kept.Members.Select(m => $"trial {m.TrialId} ({m.Family}, {m.Weight:F3})"));
        console.MarkupLine($"Wrote [bold]{Markup.Escape(scored.File)}[/]: {scored.Rows:N0} predictions from {Markup.Escape(members)} " +
                           $"in {scored.Took.TotalSeconds:F1} s ({scored.Read.TotalSeconds:F1} s reading, {(scored.Prepare + scored.Score).TotalSeconds:F1} s preparing and scoring, " +
                           $"{scored.Write.TotalSeconds:F1} s writing).");
        return ExitCodes.Ok;
    }
}
