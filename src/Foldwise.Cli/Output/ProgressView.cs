using Foldwise.Cluster.Coordination;
using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>
/// Follows a running search: a live bar (trials done / running / best so far) on a terminal, one plain line per
/// finished trial otherwise; a summary line at the end either way.
/// </summary>
public sealed class ProgressView(IAnsiConsole console)
{
    private static readonly TimeSpan Refresh = TimeSpan.FromMilliseconds(400);

    public async Task FollowAsync(CoordinatorSession session, SearchDefinition definition, CancellationToken cancellation)
    {
        if (console.Profile.Capabilities.Interactive && console.Profile.Capabilities.Ansi)
        {
            await FollowLiveAsync(session, definition, cancellation);
        }
        else
        {
            await FollowPlainAsync(session, definition, cancellation);
        }

        var end = session.Coordinator.Progress();
        console.MarkupLine($"Search stopped ({Describe(end.Stopping)}): {end.Done} done, {end.Failed} failed, {end.Queued} left queued, " +
                           $"best {FormatBest(end)} after {TimeSpan.FromSeconds(end.SpentSeconds):hh\\:mm\\:ss}");
    }

    private async Task FollowLiveAsync(CoordinatorSession session, SearchDefinition definition, CancellationToken cancellation)
    {
        await console.Progress()
            .AutoClear(false)
            .Columns(new TaskDescriptionColumn { Alignment = Justify.Left }, new ProgressBarColumn(), new PercentageColumn(), new ElapsedTimeColumn())
            .StartAsync(async context =>
            {
                var task = context.AddTask("starting", maxValue: 1);
                while (!session.Finished.IsCompleted)
                {
                    Update(task, session.Coordinator.Progress(), definition);
                    await Task.WhenAny(session.Finished, Task.Delay(Refresh, cancellation));
                    cancellation.ThrowIfCancellationRequested();
                }

                Update(task, session.Coordinator.Progress(), definition);
                task.Value = task.MaxValue;
            });
    }

    private async Task FollowPlainAsync(CoordinatorSession session, SearchDefinition definition, CancellationToken cancellation)
    {
        var spaces = definition.Families.ToDictionary(f => f.Family, f => f.Space);
        void Line(TrialRecord trial)
        {
            var p = session.Coordinator.Progress();
            // Plain lines go straight to the writer: no wrapping at a guessed width, one trial per line.
            console.Profile.Out.Writer.WriteLine(
                $"trial {trial.Id,4} {trial.Family,-9} rung {trial.Rung} {trial.Budget,4} rounds {trial.Score:F5} " +
                $"{trial.Duration?.TotalSeconds,5:F1} s {trial.Worker}/{trial.Slot} | done {p.Done}{Of(p.TrialBudget)} running {p.Running} best {p.Best:F5} | " +
                trial.Parameters.Describe(spaces.GetValueOrDefault(trial.Family)));
        }

        session.TrialFinished += Line;
        try
        {
            await session.Finished.WaitAsync(cancellation);
        }
        finally
        {
            session.TrialFinished -= Line;
        }
    }

    private static void Update(ProgressTask task, SearchProgress p, SearchDefinition definition)
    {
        if (p.TrialBudget is { } budget)
        {
            task.MaxValue = budget;
            task.Value = p.Done + p.Failed;
        }
        else if (definition.Budget.Hours is { } hours)
        {
            task.MaxValue = hours * 3600;
            task.Value = Math.Min(task.MaxValue, p.SpentSeconds);
        }

        task.Description = Markup.Escape($"done {p.Done}{Of(p.TrialBudget)} · running {p.Running} · failed {p.Failed} · best {FormatBest(p)}");
    }

    private static string Of(int? budget) => budget is { } b ? $"/{b}" : "";

    private static string FormatBest(SearchProgress p) =>
        p.BestByFamily.Count == 0 ? "–" : string.Join(", ", p.BestByFamily.OrderBy(kv => kv.Value).Select(kv => $"{kv.Value:F5} ({kv.Key})"));

    private static string Describe(StopReason? reason) => reason switch
    {
        StopReason.TrialBudget => "trial budget reached",
        StopReason.HoursBudget => "hours budget reached",
        StopReason.ScheduleExhausted => "schedule complete",
        StopReason.Requested => "stopped by request",
        _ => "running",
    };
}
