using System.Globalization;
using Foldwise.Cli.Report;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Commands;

/// <summary>
/// A search's standing as a person reads it: finished or running, trials by state, queue, time against the
/// budget, best score per family and what each machine's slots are doing.
/// </summary>
public static class StatusView
{
    private static readonly CultureInfo Invariant = CultureInfo.InvariantCulture;

    public static void Render(IAnsiConsole console, StoredSearch search)
    {
        var trials = search.Trials;
        var header = search.Header;
        var budget = search.Definition.Budget;
        int Count(TrialState s) => trials.Count(t => t.State == s);

        console.MarkupLine(header.Finished
            ? $"Search [bold]{Markup.Escape(search.Definition.Name)}[/] finished" + (search.Blend is null ? "." : " and its blend is stored.")
            : $"Search [bold]{Markup.Escape(search.Definition.Name)}[/] is not finished (running, or stopped before its budget).");
        console.WriteLine(
            $"Trials: {trials.Count} created: {Count(TrialState.Done)} done, {Count(TrialState.Running)} running, " +
            $"{Count(TrialState.Queued)} queued, {Count(TrialState.Failed)} failed" +
            (budget.Trials is { } n ? $" (budget {n} trials)" : "") + ".");
        console.WriteLine($"Queue length: {Count(TrialState.Queued)}.");
        console.WriteLine("Time spent: " + Clock(header.SpentSeconds) +
            (budget.Hours is { } h ? $" of {Clock(h * 3600)} ({(100 * header.SpentSeconds / (h * 3600)).ToString("F0", Invariant)} %)" : " (no hours budget)") + ".");

        var best = new Table().Border(TableBorder.Simple).AddColumns("family", $"best OOF {search.Metric.Name}", "trial", "rounds", "done");
        foreach (var family in search.Definition.Families.Select(f => f.Family))
        {
            var done = trials.Where(t => t.Family == family && t.State == TrialState.Done && t.Score is not null).ToList();
            var top = done.Where(t => t.AllFolds).OrderBy(t => t.Score).ThenBy(t => t.Id).FirstOrDefault();
            best.AddRow(family, top?.Score?.ToString("F5", Invariant) ?? "none yet", top?.Id.ToString(Invariant) ?? "", top?.Budget.ToString(Invariant) ?? "", done.Count.ToString(Invariant));
        }

        console.Write(best);
        RenderSlots(console, trials);
        RenderFailures(console, trials);
    }

    /// <summary>The latest failures and lost attempts with their reasons, so a broken machine shows by name.</summary>
    private static void RenderFailures(IAnsiConsole console, IReadOnlyList<TrialRecord> trials)
    {
        var reasons = trials
            .SelectMany(t => t.LostAttempts.Select(lost => $"trial {t.Id}, {lost}")
                .Concat(t.FailureReason is { } failed ? [$"trial {t.Id} failed: {failed}"] : []))
            .TakeLast(5)
            .ToList();
        if (reasons.Count > 0)
        {
            console.WriteLine("Latest failures:");
            foreach (string reason in reasons)
            {
                console.WriteLine("  " + reason);
            }
        }
    }

    private static void RenderSlots(IAnsiConsole console, IReadOnlyList<TrialRecord> trials)
    {
        var running = trials.Where(t => t.State == TrialState.Running).OrderBy(t => t.Worker).ThenBy(t => t.Slot).ToList();
        if (running.Count == 0)
        {
            console.WriteLine("Running now: none.");
            return;
        }

        var table = new Table().Border(TableBorder.Simple).AddColumns("machine/slot", "trial", "family", "rounds", "started");
        foreach (var t in running)
        {
            table.AddRow(Markup.Escape($"{t.Worker}/{t.Slot}"), t.Id.ToString(Invariant), t.Family, t.Budget.ToString(Invariant), t.Started?.ToString("u", Invariant) ?? "");
        }

        console.WriteLine($"Running now: {running.Count} trial(s) on {running.Select(t => t.Worker).Distinct().Count()} machine(s).");
        console.Write(table);
    }

    /// <summary>Hours, minutes and seconds, e.g. <c>01:02:03</c>.</summary>
    public static string Clock(double seconds) =>
        TimeSpan.FromSeconds(Math.Round(seconds)).ToString(seconds >= 86400 ? @"d\.hh\:mm\:ss" : @"hh\:mm\:ss", Invariant);
}
