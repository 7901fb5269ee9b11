using Foldwise.Cli.Running;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>
/// Renders a search's events: preparation lines, then a live bar (trials done / running / best so far) on a
/// terminal or one plain line per finished trial otherwise, a summary line when the search stops, and the blend.
/// </summary>
public sealed class ProgressView(IAnsiConsole console) : IProgress<SearchEvent>
{
    private readonly object gate = new();
    private LiveBar? live;
    private IReadOnlyDictionary<string, ParameterSpace> spaces = new Dictionary<string, ParameterSpace>();
    private readonly StepLine stepLine = new(console);
    private readonly AdvanceLineThrottle advanceLines = new();

    public void Report(SearchEvent value)
    {
        lock (gate)
        {
            Render(value);
        }
    }

    private void Render(SearchEvent value)
    {
        if (value is StepProgress step)
        {
            stepLine.Show(step);
            return;
        }

        stepLine.Clear();
        switch (value)
        {
            case TablesRead r:
                console.MarkupLine(
                    $"Read [bold]{Markup.Escape(Path.GetFileName(r.TrainFile))}[/] {r.TrainRows:N0} rows × {r.Features:N0} features " +
                    $"({r.Density:P1} non-zero) and [bold]{Markup.Escape(Path.GetFileName(r.TestFile))}[/] {r.TestRows:N0} rows in {r.Took.TotalSeconds:F1} s");
                if (r.IgnoredTestColumns.Length > 0)
                {
                    console.MarkupLine($"  The test table's {r.IgnoredTestColumns.Length} column(s) missing from training are ignored: " +
                                       $"{Markup.Escape(string.Join(", ", r.IgnoredTestColumns.Take(5)))}{(r.IgnoredTestColumns.Length > 5 ? ", …" : "")}");
                }

                break;
            case LeafSizesNarrowed l:
                foreach (string change in l.Changes)
                {
                    console.MarkupLine($"  {Markup.Escape(change)}");
                }

                break;
            case ColumnsScreened s:
                console.MarkupLine(
                    $"Screening kept {s.Report.Kept.Length:N0} of {s.Report.ColumnsRead:N0} columns: dropped {s.Report.Count(Core.Screening.DropReason.Constant):N0} constant, " +
                    $"{s.Report.Count(Core.Screening.DropReason.Duplicate):N0} duplicate, {s.Report.Count(Core.Screening.DropReason.TooFewNonZero):N0} with fewer than {s.MinNonZero} non-zero cells" +
                    $"{DropCount(s.Report, Core.Screening.DropReason.AllMissing, "all missing")}{DropCount(s.Report, Core.Screening.DropReason.NearlyUnique, "nearly unique text")}");
                foreach (string line in Core.Screening.ColumnNotes.Lines(s.Report, s.Families))
                {
                    console.MarkupLine("  " + Markup.Escape(line));
                }

                break;
            case SearchResumed r:
                console.MarkupLine($"Resuming [bold]{Markup.Escape(r.SearchId)}[/]: {r.Done} trial(s) done, {r.ToRunAgain} to run again, " +
                                   $"{r.SpentBefore:hh\\:mm\\:ss} spent before.");
                break;
            case SearchStarted s:
                Started(s);
                break;
            case CoordinatorListening l:
                // Networked: say how to join, and who comes and goes (one plain line each); an accepted open cluster says its risk.
                if (OpenCluster.Warning(System.Net.IPAddress.Parse(l.Address), l.MutualTls) is { } risk)
                {
                    console.Profile.Out.Writer.WriteLine(risk);
                }

                console.Profile.Out.Writer.WriteLine(
                    $"Coordinator listening on {l.Address}:{l.Port}" +
                    (l.MutualTls ? " (mutual TLS)" : " (no certificate)") +
                    $"; workers join with: foldwise worker --join {l.Address}:{l.Port}" + (l.MutualTls ? " --cert FILE" : ""));
                break;
            case ClusterChanged c:
                console.Profile.Out.Writer.WriteLine($"cluster {c.Change}");
                break;
            case TrialScored t:
                Scored(t);
                break;
            case AttemptFailed a:
                console.MarkupLine($"[yellow]Attempt {a.Attempt} of trial {a.TrialId} failed on {Markup.Escape(a.Machine)}: {Markup.Escape(a.Reason)}; queued again[/]");
                break;
            case TrialFailed f:
                console.MarkupLine($"[red]Trial {f.Trial.Id} failed for good: {Markup.Escape(f.Trial.FailureReason ?? "no reason recorded")}[/]");
                live?.Ended(f.Trial, f.Progress);
                break;
            case WorkerQuarantined q:
                console.MarkupLine($"[red]Worker {Markup.Escape(q.Worker)} quarantined: {Markup.Escape(q.Reason)}; it gets no more trials of this search[/]");
                break;
            case SlotFoldFitted f:
                FoldFitted(f);
                break;
            case TrialStarted t:
                live?.Started(t);
                break;
            case SlotTrialAdvanced a:
                Advanced(a);
                break;
            case SearchStopped s:
                Stopped(s.Progress);
                break;
            case BlendFellBack b:
                console.MarkupLine($"[yellow]No trial reached its family's full budget; blending each family's trials that went furthest: {Markup.Escape(string.Join(", ", b.Families))}.[/]");
                break;
            case BlendSolved b:
                BlendView.Render(console, b.Summary, Metric.For(b.Metric), b.Trials);
                console.MarkupLine($"Wrote [bold]{Markup.Escape(b.PredictionFile)}[/]: {b.Predictions:N0} predictions.");
                break;
            case ModelsKept k:
                console.MarkupLine($"Kept the models of {k.Kept.Members.Length} blend member(s) in [bold]{Markup.Escape(k.Folder)}[/] " +
                                   $"({k.Kept.Bytes / 1e6:F1} MB; {k.Refitted} re-fitted in {k.Took.TotalSeconds:F1} s, test predictions within {k.Kept.LargestDifference:G2}); " +
                                   "score new rows with 'foldwise predict STORE --rows FILE --out FILE'.");
                break;
            case ModelsNotKept n:
                console.MarkupLine($"[yellow]Models not kept: {Markup.Escape(n.Reason)}[/]");
                break;
            default:
                break;
        }
    }

    private void Started(SearchStarted s)
    {
        var definition = s.Definition;
        spaces = definition.Families.ToDictionary(f => f.Family, f => f.Space);
        console.MarkupLine($"Search [bold]{Markup.Escape(s.SearchId)}[/]: {DefinitionWords.Of(definition.Schedule.Kind)} with {DefinitionWords.Of(definition.Schedule.Proposer)}, " +
                           $"{string.Join(" + ", definition.Families.Select(f => f.Family))}, {definition.Folds}-fold{(definition.Schedule.ByFolds ? $" (new candidates screened on the first {definition.Schedule.ScreenFolds})" : "")}, {s.LocalSlots} local slot(s)");
        if (console.Profile.Capabilities.Interactive && console.Profile.Capabilities.Ansi)
        {
            live = new LiveBar(console, definition);
        }
    }

    private void Scored(TrialScored t)
    {
        if (live is not null)
        {
            live.Ended(t.Trial, t.Progress);
            return;
        }

        var trial = t.Trial;
        var p = t.Progress;
        // Plain lines go straight to the writer: no wrapping at a guessed width, one trial per line.
        console.Profile.Out.Writer.WriteLine(
            $"trial {trial.Id,4} {trial.Family,-9} rung {trial.Rung} {trial.Budget,4} rounds{(trial.AllFolds ? "" : $" on {trial.Folds} fold{(trial.Folds == 1 ? "" : "s")}")}{(trial.RoundsContinued > 0 ? $" ({trial.RoundsContinued} continued)" : "")} {trial.Score:F5} " +
            $"{trial.Duration?.TotalSeconds,5:F1} s {trial.Worker}/{trial.Slot} | done {p.Done}{Of(p.TrialBudget)} running {p.Running} best {p.Best:F5} | " +
            trial.Parameters.Describe(spaces.GetValueOrDefault(trial.Family)));
    }

    private void FoldFitted(SlotFoldFitted f)
    {
        if (live is not null)
        {
            live.FoldFitted(f);
        }
        else if (f.IsLong)
        {
            console.Profile.Out.Writer.WriteLine($"  trial {f.TrialId}: fold {f.Fold + 1} of {f.Folds} fitted after {f.Elapsed.TotalSeconds:F0} s ({f.Worker}/{f.Slot})");
        }
    }

    private void Advanced(SlotTrialAdvanced a)
    {
        if (live is not null)
        {
            live.Advanced(a);
        }
        else if (advanceLines.Due(a))
        {
            console.Profile.Out.Writer.WriteLine($"  trial {a.TrialId}: {a.Stage} after {a.Elapsed.TotalSeconds:F0} s ({a.Worker}/{a.Slot})");
        }
    }

    private void Stopped(SearchProgress end)
    {
        live?.Finish(end);
        live = null;
        console.MarkupLine($"Search stopped ({Describe(end.Stopping)}): {end.Done} done, {end.Failed} failed, {end.Queued} left queued, " +
                           $"best {FormatBest(end)} after {TimeSpan.FromSeconds(end.SpentSeconds):hh\\:mm\\:ss}");
    }

    internal static string Of(int? budget) => budget is { } b ? $"/{b}" : "";

    internal static string FormatBest(SearchProgress p) =>
        p.BestByFamily.Count == 0 ? "–" : string.Join(", ", p.BestByFamily.OrderBy(kv => kv.Value).Select(kv => $"{kv.Value:F5} ({kv.Key})"));

    /// <summary>Why a search stopped, in the words the progress view prints.</summary>
    internal static string Describe(StopReason? reason) => reason switch
    {
        StopReason.TrialBudget => "trial budget reached",
        StopReason.HoursBudget => "hours budget reached",
        StopReason.ScheduleExhausted => "schedule complete",
        StopReason.Requested => "stopped by request",
        _ => "running",
    };

    private static string DropCount(Core.Screening.ScreeningReport report, Core.Screening.DropReason reason, string what) =>
        report.Count(reason) > 0 ? $", {report.Count(reason):N0} {what}" : "";
}
