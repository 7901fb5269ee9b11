using System.Diagnostics;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Blending;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Storage;

namespace Foldwise.Tuning;

/// <summary>
/// The final stage: pools the best full-budget trials of each family, solves the weights on their out-of-fold
/// predictions, stores the blend, writes the blended test predictions on the original scale, and keeps the members'
/// fold models (<see cref="ModelKeeping"/>).
/// </summary>
public static class BlendStep
{
    public const string PredictionFileName = "predictions.csv";

    /// <summary>
    /// <paramref name="abandon"/> is checked before the solve and again before anything is written, so an abandoned
    /// blend leaves the previous prediction file and blend record as they were. Its span is a child of
    /// <paramref name="search"/> (the search's span) when given. <paramref name="tables"/>, the search's tables when the
    /// process holds them, spare the members' re-fit reading the stored ones again.
    /// </summary>
    public static BlendSummary Run(
        SearchStore store,
        SearchHeader header,
        SearchDefinition definition,
        string outDir,
        IProgress<SearchEvent> events,
        BlendOptions? options = null,
        ActivityContext search = default,
        SearchTables? tables = null,
        CancellationToken abandon = default)
    {
        options ??= definition.Blend;
        using var span = FoldwiseTelemetry.Source.StartActivity(FoldwiseTelemetry.BlendSpan, ActivityKind.Internal, search);
        var metric = Metric.For(definition.Metric);
        var trials = store.LoadTrials();
        var pool = BlendPool.Select(trials, options.Pool, f => definition.BudgetOf(f).FullBudget);
        if (pool.Count == 0)
        {
            // No candidate reached its family's full budget (a very small trial budget): blend what went furthest in each family.
            var done = trials.Where(t => t.State == TrialState.Done && t.AllFolds).ToList();
            var furthest = done.GroupBy(t => t.Family, StringComparer.Ordinal).ToDictionary(g => g.Key, g => g.Max(t => t.Budget), StringComparer.Ordinal);
            if (furthest.Count == 0)
            {
                // Only trials screened on some folds are done: none covers every row, so none can be blended.
                throw new InputException(
                    "nothing to blend: no trial of this search trained every fold (its budget ran out while new candidates were still screened on " +
                    "the first folds); resume it, or run it with a longer budget.hours or more budget.trials, or with schedule.screen_folds 0 to screen on rounds");
            }

            pool = BlendPool.Select(trials, options.Pool, f => furthest.GetValueOrDefault(f, -1));
            events.Report(new BlendFellBack([.. definition.Families
                .Where(f => furthest.ContainsKey(f.Family))
                .Select(f => new FamilyReach(f.Family, furthest[f.Family], definition.BudgetOf(f.Family).FullBudget))]));
        }

        var vectors = pool.Select(t => store.LoadVectors(t.Id) ?? throw new InvalidOperationException($"trial {t.Id} is done but its predictions are missing from the store")).ToList();
        abandon.ThrowIfCancellationRequested();
        var target = header.TrainTarget.Select(metric.Forward).ToArray();
        var result = BlendStage.Run(new BlendInput(
            options,
            [.. pool.Select((t, i) => new BlendCandidate(t.Id, t.Family, vectors[i].OutOfFold))],
            target,
            header.Folds,
            metric));
        abandon.ThrowIfCancellationRequested();
        var weights = pool.Select(t => result.Summary.Members.Single(m => m.TrialId == t.Id).Weight).ToList();
        var blended = BlendStage.Combine(weights, [.. vectors.Select(v => v.Test)]);
        string path = Path.Combine(outDir, PredictionFileName);
        PredictionFile.Write(path, definition.Data.IdColumn, definition.Data.TargetColumn, header.TestIds, [.. blended.Select(metric.Inverse)]);
        store.SaveBlend(result.Summary);
        span?.SetTag("foldwise.blend.mode", DefinitionWords.Of(result.Summary.Mode)).SetTag("foldwise.blend.pool", pool.Count)
            .SetTag("foldwise.blend.nested", result.Summary.NestedScore).SetTag("foldwise.blend.in_sample", result.Summary.InSampleScore);
        events.Report(new BlendSolved(result.Summary, definition.Metric, [.. trials], path, header.TestIds.Length));
        ModelKeeping.Keep(store, header, definition, outDir, result.Summary, events, tables, abandon);
        return result.Summary;
    }
}
