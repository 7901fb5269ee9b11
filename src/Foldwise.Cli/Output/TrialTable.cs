using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>The trial history as a terminal table: one row per trial, with its score, noise, rung, lineage and machine.</summary>
public static class TrialTable
{
    public static void Render(IAnsiConsole console, IReadOnlyList<TrialRecord> trials, SearchDefinition definition, Metric metric)
    {
        var spaces = definition.Families.ToDictionary(f => f.Family, f => f.Space);
        var table = new Table()
            .AddColumns("trial", "family", "state", "rung", "rounds", $"OOF {metric.Name}", "fold ±", "proposer", "parent", "machine/slot", "seconds", "parameters");
        foreach (var t in trials)
        {
            table.AddRow(
                t.Id.ToString(),
                t.Family,
                t.State.ToString().ToLowerInvariant(),
                t.Rung.ToString(),
                t.Budget.ToString(),
                t.Score?.ToString("F5") ?? "",
                t.FoldScores.Length > 1 ? BlendView.Spread(t.FoldScores).ToString("F4") : "",
                t.Proposer,
                t.ParentId?.ToString() ?? "",
                t.Worker is null ? "" : $"{t.Worker}/{t.Slot}",
                t.Duration?.TotalSeconds.ToString("F1") ?? "",
                Markup.Escape(t.Parameters.Describe(spaces.GetValueOrDefault(t.Family))));
        }

        console.Write(table);
        console.MarkupLine($"{trials.Count} trial(s): {trials.Count(t => t.State == TrialState.Done)} done, " +
                           $"{trials.Count(t => t.State == TrialState.Running)} running, {trials.Count(t => t.State == TrialState.Queued)} queued, " +
                           $"{trials.Count(t => t.State == TrialState.Failed)} failed.");
    }
}
