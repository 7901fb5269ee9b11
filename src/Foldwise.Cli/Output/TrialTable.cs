using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>The trial history as a terminal table: one row per trial, with its score, noise, rung, lineage and machine.</summary>
public static class TrialTable
{
    /// <param name="wide">Adds the parameters column (long: it needs a wide terminal).</param>
    public static void Render(IAnsiConsole console, IReadOnlyList<TrialRecord> trials, SearchDefinition definition, Metric metric, bool wide = false)
    {
        var spaces = definition.Families.ToDictionary(f => f.Family, f => f.Space);
        // A schedule without brackets (plain ASHA, full budget) stores 0: the column would say nothing.
        var brackets = BracketNumbers.For(definition);
        bool bracketed = trials.Any(t => t.Bracket > 0);
        // Only a schedule that screens on folds trains some trials on fewer than every fold.
        bool screened = trials.Any(t => !t.AllFolds);
        string[] columns = ["trial", "family", "state", "rung", .. bracketed ? ["bracket"] : Array.Empty<string>(), "rounds", .. screened ? ["folds"] : Array.Empty<string>(), $"OOF {metric.Name}", "fold sd", "from", "machine/slot", "secs"];
        var table = new Table().Border(TableBorder.Simple).AddColumns(columns);
        if (wide)
        {
            table.AddColumn("parameters");
        }

        foreach (var t in trials)
        {
            List<string> cells =
            [
                t.Id.ToString(),
                t.Family,
                t.State.ToString().ToLowerInvariant(),
                t.Rung.ToString(),
                .. bracketed ? [brackets.Of(t.Family, t.Bracket)?.ToString() ?? ""] : Array.Empty<string>(),
                t.Budget.ToString(),
                .. screened ? [(t.AllFolds ? definition.Folds : t.Folds).ToString()] : Array.Empty<string>(),
                t.Score?.ToString("F5") ?? "",
                t.FoldScores.Length > 1 ? BlendView.Spread(t.FoldScores).ToString("F4") : "",
                t.ParentId is { } parent ? $"{t.Proposer} of {parent}" : t.Proposer,
                Markup.Escape(t.Worker is null ? "" : $"{t.Worker}/{t.Slot}"),
                t.Duration?.TotalSeconds.ToString("F1") ?? "",
            ];
            if (wide)
            {
                cells.Add(Markup.Escape(t.Parameters.Describe(spaces.GetValueOrDefault(t.Family))));
            }

            table.AddRow([.. cells]);
        }

        console.Write(table);
        console.MarkupLine($"{trials.Count} trial(s): {trials.Count(t => t.State == TrialState.Done)} done, " +
                           $"{trials.Count(t => t.State == TrialState.Running)} running, {trials.Count(t => t.State == TrialState.Queued)} queued, " +
                           $"{trials.Count(t => t.State == TrialState.Failed)} failed.");
        var schedule = definition.Schedule;
        if (wide && schedule.RateScaling > 0 && trials.Any(t => t.Budget < definition.BudgetOf(t.Family).FullBudget))
        {
            console.MarkupLine(Markup.Escape(
                $"Parameters are as drawn; a trial below its family's full budget ({FamilyRungs.Describe(definition)}) ran learning_rate × (full budget / budget)" +
                $"{(schedule.RateScaling == 1 ? "" : $"^{schedule.RateScaling:G3}")}, at most {ShortRungRate.Ceiling:G} (schedule.rate_scaling)."));
        }
    }
}
