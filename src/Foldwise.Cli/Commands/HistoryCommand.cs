using Foldwise.Cli.Output;
using Foldwise.Cli.Report;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise history</c>: the trials, best first; reads the store without blocking a running search.</summary>
public sealed class HistoryCommand(IAnsiConsole console) : Command<HistorySettings>
{
    public override int Execute(CommandContext context, HistorySettings settings, CancellationToken cancellationToken)
    {
        var search = StoredSearch.Load(settings.Store);
        var definition = search.Definition;
        var trials = Filter(search.Trials, settings);
        if (settings.Json)
        {
            console.Profile.Out.Writer.WriteLine(TrialJson.Write(trials, definition));
        }
        else
        {
            TrialTable.Render(console, trials, definition, Metric.For(definition.Metric), settings.Wide);
        }

        return ExitCodes.Ok;
    }

    /// <summary>
    /// Best first: done trials by score (ties by id), those on every fold before those a fold screen scored on some
    /// folds only (their scores cover other rows); then running, queued and failed ones by id.
    /// </summary>
    public static IReadOnlyList<TrialRecord> Filter(IEnumerable<TrialRecord> trials, HistorySettings settings)
    {
        var state = settings.State is { } s ? Enum.Parse<TrialState>(s, ignoreCase: true) : (TrialState?)null;
        var chosen = trials
            .Where(t => settings.Family is null || t.Family == settings.Family)
            .Where(t => settings.Rung is null || t.Rung == settings.Rung)
            .Where(t => state is null || t.State == state)
            .OrderBy(t => t.State == TrialState.Done ? 0 : t.State == TrialState.Running ? 1 : t.State == TrialState.Queued ? 2 : 3)
            .ThenBy(t => t.AllFolds ? 0 : 1)
            .ThenBy(t => t.Score ?? double.MaxValue)
            .ThenBy(t => t.Id);
        return settings.Top is { } top ? [.. chosen.Take(top)] : [.. chosen];
    }
}
