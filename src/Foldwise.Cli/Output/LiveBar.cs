using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>
/// The terminal's live bar while a search runs: it starts at <c>SearchStarted</c>, moves with each result and
/// closes at the stop, before the summary line is written below it.
/// </summary>
internal sealed class LiveBar
{
    private readonly SearchDefinition definition;
    private readonly TaskCompletionSource<ProgressTask> task = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly TaskCompletionSource<SearchProgress> end = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private readonly Task running;

    /// <summary>Each slot's running trial and how far it has come, by worker/slot.</summary>
    private readonly Dictionary<string, (int TrialId, string Text)> slots = new(StringComparer.Ordinal);
    private SearchProgress? latest;

    public LiveBar(IAnsiConsole console, SearchDefinition definition)
    {
        this.definition = definition;
        running = console.Progress()
            .AutoClear(false)
            .Columns(new TaskDescriptionColumn { Alignment = Justify.Left }, new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn())
            .StartAsync(async context =>
            {
                var bar = context.AddTask("starting", maxValue: 1);
                task.SetResult(bar);
                var last = await end.Task;
                Update(bar, last, definition, "");
                bar.Value = bar.MaxValue;
            });
    }

    /// <summary>Takes a finished trial (scored or failed for good) off its slot and shows the new counts.</summary>
    public void Ended(TrialRecord trial, SearchProgress progress)
    {
        string slot = trial.Worker + "/" + trial.Slot;
        if (slots.TryGetValue(slot, out var shown) && shown.TrialId == trial.Id)
        {
            slots.Remove(slot);
        }

        Update(progress);
    }

    public void Update(SearchProgress progress)
    {
        latest = progress;
        if (task.Task.IsCompletedSuccessfully)
        {
            Update(task.Task.Result, progress, definition, Folds());
        }
    }

    /// <summary>
    /// Shows, beside the counts, where a trial was leased: a worker's slots tell their own screen how far they have come,
    /// not the coordinator's, so for them this is all the bar shows until the trial is scored.
    /// </summary>
    public void Started(TrialStarted started)
    {
        slots[started.Trial.Worker + "/" + started.Trial.Slot] = (started.Trial.Id, "on " + started.Trial.Worker + "/" + started.Trial.Slot);
        Redraw();
    }

    /// <summary>Shows, beside the counts, how far each slot's running trial has come (its last fold fitted).</summary>
    public void FoldFitted(SlotFoldFitted fold)
    {
        string slot = fold.Worker + "/" + fold.Slot;
        if (fold.Fold + 1 >= fold.Folds)
        {
            slots.Remove(slot);
        }
        else
        {
            slots[slot] = (fold.TrialId, $"{fold.Fold + 1}/{fold.Folds} folds");
        }

        Redraw();
    }

    /// <summary>Shows, beside the counts, the folds a slot's trial has prepared, then the rounds it has trained on every fold (its folds finish together at the end).</summary>
    public void Advanced(SlotTrialAdvanced advance)
    {
        string stage = advance.Round == 0 ? $"{advance.FoldsReady}/{advance.Folds} folds prepared" : $"round {advance.Round}/{advance.Budget}";
        slots[advance.Worker + "/" + advance.Slot] = (advance.TrialId, stage);
        Redraw();
    }

    private void Redraw()
    {
        if (latest is { } progress)
        {
            Update(progress);
        }
        else if (task.Task.IsCompletedSuccessfully)
        {
            // No trial has finished yet: the first ones' progress is all there is to show.
            task.Task.Result.Description = Markup.Escape("first trials running" + Folds());
        }
    }

    private string Folds() => string.Concat(slots.Values.OrderBy(r => r.TrialId).Select(r => $" · trial {r.TrialId} {r.Text}"));

    /// <summary>Closes the bar and waits until it is drawn for the last time.</summary>
    public void Finish(SearchProgress progress)
    {
        end.TrySetResult(progress);
        running.GetAwaiter().GetResult();
    }

    private static void Update(ProgressTask bar, SearchProgress p, SearchDefinition definition, string folds)
    {
        if (p.TrialBudget is { } budget)
        {
            bar.MaxValue = budget;
            bar.Value = p.Done + p.Failed;
        }
        else if (definition.Budget.Hours is { } hours)
        {
            bar.MaxValue = hours * 3600;
            bar.Value = Math.Min(bar.MaxValue, p.SpentSeconds);
        }

        bar.Description = Markup.Escape($"done {p.Done}{ProgressView.Of(p.TrialBudget)} · running {p.Running} · failed {p.Failed} · best {ProgressView.FormatBest(p)}{folds}");
    }
}
