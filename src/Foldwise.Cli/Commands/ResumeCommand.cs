using Foldwise.Cli.Running;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise resume</c>: continues an interrupted search from its store and the tables kept beside it (no CSV needed);
/// a finished search exits 0 with a message, or blends again with <c>--blend</c>.
/// </summary>
public sealed class ResumeCommand(IAnsiConsole console) : AsyncCommand<ResumeSettings>
{
    public override Task<int> ExecuteAsync(CommandContext context, ResumeSettings settings, CancellationToken cancellationToken) =>
        SearchCommand.ExecuteAsync(console, settings, (search, stopping) => search.ResumeAsync(settings.Store, settings.Slots, settings.Threads, settings.Blend, stopping, cancellationToken));
}
