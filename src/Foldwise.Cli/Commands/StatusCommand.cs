using Foldwise.Cli.Report;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise status STORE</c>: where a search stands, read from its store (works while it runs).</summary>
public sealed class StatusCommand(IAnsiConsole console) : Command<StatusSettings>
{
    public override int Execute(CommandContext context, StatusSettings settings, CancellationToken cancellationToken)
    {
        StatusView.Render(console, StoredSearch.Load(settings.Store));
        return ExitCodes.Ok;
    }
}
