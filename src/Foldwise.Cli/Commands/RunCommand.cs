using Foldwise.Cli.Running;
using Foldwise.Core.Definition;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise run</c>: prepares the tables, runs the search on an embedded coordinator, blends, writes predictions.</summary>
public sealed class RunCommand(IAnsiConsole console) : AsyncCommand<RunSettings>
{
    public override async Task<int> ExecuteAsync(CommandContext context, RunSettings settings, CancellationToken cancellationToken)
    {
        var definition = settings.Definition is { } file
            ? DefinitionDefaults.Override(DefinitionReader.Read(file), settings.Trials, settings.Hours)
            : DefinitionDefaults.FromFlags(settings.Train!, settings.Test!, settings.Id!, settings.Target!, settings.Trials, settings.Hours);
        return await SearchCommand.ExecuteAsync(console, settings, (search, stopping) => search.RunNewAsync(definition, settings.Out, settings.Slots, settings.Threads, stopping, cancellationToken));
    }
}
