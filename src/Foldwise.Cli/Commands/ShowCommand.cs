using Foldwise.Cli.Report;
using Foldwise.Storage;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise show STORE TRIAL</c>: everything the store knows about one trial; reads without blocking a running search.</summary>
public sealed class ShowCommand(IAnsiConsole console) : Command<ShowSettings>
{
    public override int Execute(CommandContext context, ShowSettings settings, CancellationToken cancellationToken)
    {
        var search = StoredSearch.Load(settings.Store);
        var trial = search.Trials.FirstOrDefault(t => t.Id == settings.Trial)
            ?? throw new StoreException($"{search.StorePath} has no trial {settings.Trial} (ids run 1 to {search.Trials.Count}).");
        if (settings.Json)
        {
            console.Profile.Out.Writer.WriteLine(ShowJson.Write(search, trial));
        }
        else
        {
            ShowView.Render(console, search, trial);
        }

        return ExitCodes.Ok;
    }
}
