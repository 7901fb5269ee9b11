using Foldwise.Cli.Report;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise report STORE --out FILE.html</c>: one self-contained page of the search's charts.</summary>
public sealed class ReportCommand(IAnsiConsole console) : Command<ReportSettings>
{
    public override int Execute(CommandContext context, ReportSettings settings, CancellationToken cancellationToken)
    {
        var (search, charts) = ReportBuilder.Build(settings.Store);
        string html = ReportPage.Html(search, charts, DateTimeOffset.UtcNow);
        ReportPage.WriteAtomically(settings.Out, html);
        console.MarkupLine($"Wrote [bold]{Markup.Escape(Path.GetFullPath(settings.Out))}[/]: {charts.Count} charts, {html.Length / 1024:N0} KB, nothing loaded from the network.");
        return ExitCodes.Ok;
    }
}
