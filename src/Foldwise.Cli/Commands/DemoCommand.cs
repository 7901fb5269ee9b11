using Foldwise.Cli.Running;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary><c>foldwise demo</c>: writes the invented freight tables and a definition, then runs it like <c>run</c> would.</summary>
public sealed class DemoCommand(IAnsiConsole console) : AsyncCommand<DemoSettings>
{
    public override async Task<int> ExecuteAsync(CommandContext context, DemoSettings settings, CancellationToken cancellationToken)
    {
        Directory.CreateDirectory(settings.Out);
        var size = settings.Quick ? DemoSize.Quick : DemoSize.Full;
        console.MarkupLine($"Writing the invented freight demo ({(settings.Quick ? "quick" : "full size")}) to [bold]{Markup.Escape(settings.Out)}[/] …");
        var (train, test) = FreightDemo.Generate(size, settings.Seed);
        DemoCsvWriter.Write(train, Path.Combine(settings.Out, "train.csv"), DemoDefinition.IdColumn, DemoDefinition.TargetColumn);
        DemoCsvWriter.Write(test, Path.Combine(settings.Out, "test.csv"), DemoDefinition.IdColumn, null);
        string definitionPath = Path.Combine(settings.Out, "search.json");
        File.WriteAllText(definitionPath, DefinitionWriter.Write(DemoDefinition.For(settings.Quick, settings.Seed)));
        console.MarkupLine($"  train.csv {train.RowCount:N0} × {train.FeatureCount:N0}, test.csv {test.RowCount:N0} rows, search.json");
        if (settings.DataOnly)
        {
            return ExitCodes.Ok;
        }

        var definition = DefinitionReader.Read(definitionPath);
        return await SearchCommand.ExecuteAsync(console, settings, (search, stopping) => search.RunNewAsync(definition, settings.Out, settings.Slots, settings.Threads, stopping, cancellationToken));
    }
}
