using Foldwise.Cli.Report;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise report STORE --out FILE.html</c>: one self-contained page of the search's charts.</summary>
public sealed class ReportCommand(IAnsiConsole console) : Command<ReportSettings>
{
    public override int Execute(CommandContext context, ReportSettings settings, CancellationToken cancellationToken)
    {
        var (search, parts) = ReportBuilder.Build(settings.Store);
        string html = ReportPage.Html(search, parts, DateTimeOffset.UtcNow);
        ReportPage.WriteAtomically(settings.Out, html);
        console.MarkupLine($"Wrote [bold]{Markup.Escape(Path.GetFullPath(settings.Out))}[/]: {parts.Sum(p => p.Charts.Count)} charts in {parts.Count(p => p.Charts.Count > 0)} parts, {html.Length / 1024:N0} KB, nothing loaded from the network.");
        return ExitCodes.Ok;
    }
}
