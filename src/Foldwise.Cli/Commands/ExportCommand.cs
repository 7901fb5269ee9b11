using System.Globalization;
using Foldwise.Cli.Report;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Storage;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise export --oof</c>: every done full-budget trial's out-of-fold predictions on the original scale, one row per
/// training row, so a user can check the scores or reuse the predictions anywhere.
/// </summary>
public sealed class ExportCommand(IAnsiConsole console) : Command<ExportSettings>
{
    public override int Execute(CommandContext context, ExportSettings settings, CancellationToken cancellationToken)
    {
        string path = StoreFile.Resolve(settings.Store);
        using var store = SearchStore.OpenReadOnly(path);
        var (header, definition) = StoredSearch.HeaderOf(store);
        var metric = Metric.For(definition.Metric);
        var trials = store.LoadTrials()
            .Where(t => t.State == TrialState.Done && t.AllFolds && t.Budget == definition.BudgetOf(t.Family).FullBudget)
            .OrderBy(t => t.Id)
            .ToList();
        var columns = trials.Select(t => store.LoadVectors(t.Id)?.OutOfFold ?? throw new InvalidOperationException($"trial {t.Id} has no stored predictions")).ToList();

        string file = settings.Oof!;
        string partial = file + ".part";
        using (var writer = new StreamWriter(partial, append: false, new System.Text.UTF8Encoding(false), 1 << 16))
        {
            writer.WriteLine(string.Join(',', new[] { definition.Data.IdColumn, definition.Data.TargetColumn }.Concat(trials.Select(t => $"trial_{t.Id}"))));
            for (int r = 0; r < header.TrainIds.Length; r++)
            {
                writer.Write(header.TrainIds[r]);
                writer.Write(',');
                writer.Write(header.TrainTarget[r].ToString("R", CultureInfo.InvariantCulture));
                foreach (var column in columns)
                {
                    writer.Write(',');
                    writer.Write(metric.Inverse(column[r]).ToString("R", CultureInfo.InvariantCulture));
                }

                writer.WriteLine();
            }
        }

        File.Move(partial, file, overwrite: true);
        console.MarkupLine($"Wrote [bold]{Markup.Escape(file)}[/]: {header.TrainIds.Length:N0} rows × {trials.Count} trial(s) at their family's full budget.");
        return ExitCodes.Ok;
    }
}
