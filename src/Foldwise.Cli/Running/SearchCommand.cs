using Foldwise.Cli.Commands;
using Foldwise.Cli.Output;
using Foldwise.Cluster.Telemetry;
using Foldwise.Tuning;
using Spectre.Console;

namespace Foldwise.Cli.Running;

/// <summary>
/// What <c>run</c>, <c>demo</c> and <c>resume</c> share: the search use case with its events drawn on the console,
/// Ctrl-C wired to its stop and abandon, and how it ended said in one line and an exit code.
/// </summary>
public static class SearchCommand
{
    public static async Task<int> ExecuteAsync(IAnsiConsole console, SearchHostSettings settings, Func<SearchRun, SearchStopping, Task<SearchResult>> run)
    {
        ArgumentNullException.ThrowIfNull(settings);
        ArgumentNullException.ThrowIfNull(run);
        using var signal = new StopSignal(console);
        var search = new SearchRun(new ProgressView(console)) { Role = settings.ToRole(), Leases = settings.ToCoordinatorOptions(), Telemetry = FoldwiseTelemetryOptions.FromEnvironment() };
        var result = await run(search, new SearchStopping(signal.Stop, signal.Abandon));
        return Ending(console, result);
    }

    private static int Ending(IAnsiConsole console, SearchResult result)
    {
        switch (result.Ending)
        {
            case SearchEnding.AlreadyFinished:
                console.MarkupLine($"Search [bold]{Markup.Escape(result.SearchId)}[/] finished already; its predictions are in [bold]{Markup.Escape(result.PredictionFile)}[/]. " +
                                   "Nothing to resume ('--blend' blends its trials again).");
                return ExitCodes.Ok;
            case SearchEnding.NothingDone:
                console.MarkupLine("[red]No trial finished, so there is nothing to blend.[/]");
                return ExitCodes.Failed;
            case SearchEnding.Abandoned:
                console.MarkupLine("[yellow]Abandoned: running trials go back to the queue; 'foldwise resume' continues the search.[/]");
                return ExitCodes.Interrupted;
            case SearchEnding.BlendAbandoned:
                console.MarkupLine($"[yellow]Abandoned the blend: every trial is stored, the prediction file was not written. 'foldwise blend {Markup.Escape(result.OutDir)}' blends them.[/]");
                return ExitCodes.Interrupted;
            case SearchEnding.StoreFailed:
                console.MarkupLine($"[red]Stopped: the store in {Markup.Escape(result.OutDir)} refused a write ({Markup.Escape(result.StoreFault ?? "")}). " +
                                   $"Every trial committed before is kept; free space, then 'foldwise resume {Markup.Escape(result.OutDir)}' continues the search.[/]");
                return ExitCodes.Failed;
            default:
                return ExitCodes.Ok;
        }
    }
}
