using System.Diagnostics;
using Foldwise.Core.Blending;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Learners;
using Foldwise.Storage;

namespace Foldwise.Tuning;

/// <summary>
/// Keeps the fold models of a blend's members beside the store, so new rows can be scored later. The coordinator
/// re-fits each member from the stored tables with the trial's own parameters, budget and seeds (workers send back
/// predictions, not models), checks the re-fit reproduces the search's test predictions, and writes one file per
/// member (<see cref="KeptModelFiles"/>). Members kept by an earlier blend of the same search are not fitted again.
/// </summary>
public static class ModelKeeping
{
    /// <summary>
    /// The largest relative difference (absolute below 1) allowed between a re-fitted member's test predictions and
    /// the search's own, on the fitting scale. Larger means the re-fit is not the model the search scored.
    /// </summary>
    public const double Tolerance = 1e-6;

    /// <summary>
    /// Keeps the members with a positive weight and records them in the store; on any failure the store's record of
    /// kept models is removed (it would describe another blend) and <see cref="ModelsNotKept"/> says why. Members are
    /// re-fitted on <paramref name="tables"/> when given (the search's own, in memory), else on the stored tables.
    /// </summary>
    public static KeptModels? Keep(
        SearchStore store,
        SearchHeader header,
        SearchDefinition definition,
        string outDir,
        BlendSummary blend,
        IProgress<SearchEvent> events,
        SearchTables? tables = null,
        CancellationToken abandon = default)
    {
        ArgumentNullException.ThrowIfNull(store);
        ArgumentNullException.ThrowIfNull(header);
        ArgumentNullException.ThrowIfNull(blend);
        ArgumentNullException.ThrowIfNull(events);
        var clock = Stopwatch.StartNew();
        try
        {
            var (kept, refitted) = KeepMembers(store, header, definition, outDir, blend, tables, events, abandon);
            store.SaveKept(kept);
            RemoveUnused(outDir, kept);
            events.Report(new ModelsKept(kept, KeptModelFiles.FolderIn(outDir), refitted, clock.Elapsed));
            return kept;
        }
        catch (OperationCanceledException)
        {
            store.ForgetKept();
            throw;
        }
        catch (Exception ex) when (ex is NotKeptException or InputException)
        {
            store.ForgetKept();
            events.Report(new ModelsNotKept(ex.Message));
            return null;
        }
        catch (AggregateException ex) when (ex.InnerExceptions.All(e => e is not OperationCanceledException))
        {
            // A re-fit failed (a learner refused its job, a native library failed): the blend stands, its models are not kept.
            store.ForgetKept();
            events.Report(new ModelsNotKept($"re-fitting a member failed: {ex.InnerExceptions[0].Message}"));
            return null;
        }
    }

    private static (KeptModels Kept, int Refitted) KeepMembers(
        SearchStore store, SearchHeader header, SearchDefinition definition, string outDir, BlendSummary blend, SearchTables? tables, IProgress<SearchEvent> events, CancellationToken abandon)
    {
        var earlier = store.LoadKept();
        var weighted = blend.Members.Where(m => m.Weight > 0).ToList();
        var reused = new Dictionary<int, KeptMember>();
        foreach (var member in weighted)
        {
            var before = earlier?.SearchId == header.SearchId ? earlier.Members.FirstOrDefault(m => m.TrialId == member.TrialId) : null;
            if (before is not null && KeptModelFiles.Holds(outDir, before))
            {
                reused[member.TrialId] = before with { Weight = member.Weight };
            }
            else if (LearnerCatalog.BuiltIn.Get(member.Family) is not IKeepsModels)
            {
                throw new NotKeptException($"the {member.Family} family cannot keep its models");
            }
        }

        var refit = weighted.Where(m => !reused.ContainsKey(m.TrialId)).ToList();
        var refitted = new Dictionary<int, Refit>();
        if (refit.Count > 0)
        {
            var trials = store.LoadTrials().ToDictionary(t => t.Id);
            var searched = refit.ToDictionary(
                m => m.TrialId,
                m => store.LoadVectors(m.TrialId)?.Test ?? throw new NotKeptException($"trial {m.TrialId}'s test predictions are missing from the store"));
            tables ??= new SearchTables(TableFiles.Read(outDir, header.TrainHash, "training"), TableFiles.Read(outDir, header.TestHash, "test"));
            var data = TrialData.From(tables.Train, tables.Test, header.Folds, Metric.For(definition.Metric)) with { LevelCodeFamilies = definition.LevelCodeFamilies() };

            // One thread per fit and the members side by side, as a worker's slots run (single-threaded fits, one per
            // core, were the fastest way to use a machine's cores in every case measured); the results do not depend on it.
            var options = new ParallelOptions { MaxDegreeOfParallelism = Environment.ProcessorCount, CancellationToken = abandon };
            var pacer = ProgressPacer.For(PreparationStep.Refitting, $"{refit.Count} blend member(s)", events);
            int folds = refit.Count * header.Folds.FoldCount, fitted = 0;
            void FoldDone(int fold)
            {
                lock (pacer)
                {
                    pacer.Tick(++fitted, folds);
                }
            }

            Parallel.ForEach(refit, options, member =>
            {
                var fit = TrialFit.Refit(trials[member.TrialId], trials, definition);
                var keeping = new KeepingLearner(LearnerCatalog.BuiltIn.Get(member.Family));
                var outcome = new TrialExecutor(keeping, stopping: null).Run(data, fit.Run, fit.Budget, fit.Seed, threads: 1, abandon, FoldDone);
                lock (refitted)
                {
                    refitted[member.TrialId] = new Refit(keeping.Models, LargestDifference(outcome.Test, searched[member.TrialId]));
                }
            });
        }

        var members = new List<KeptMember>();
        foreach (var member in weighted)
        {
            if (reused.TryGetValue(member.TrialId, out var kept))
            {
                members.Add(kept);
                continue;
            }

            var (models, difference) = refitted[member.TrialId];
            if (difference > Tolerance)
            {
                throw new NotKeptException(
                    $"re-fitting trial {member.TrialId} ({member.Family}) gave test predictions up to {difference:G3} (relative) from the search's own, above {Tolerance:G}; " +
                    "its models would not be the ones the search scored, so none were kept");
            }

            var (hash, bytes) = KeptModelFiles.Write(outDir, header.SearchId, member.TrialId, member.Family, models);
            members.Add(new KeptMember(member.TrialId, member.Family, member.Weight, hash, bytes, models.Count, difference));
        }

        return (new KeptModels(header.SearchId, [.. members], DateTimeOffset.UtcNow), refit.Count);
    }

    /// <summary>The largest difference between two vectors, relative to the search's value (absolute below 1).</summary>
    internal static double LargestDifference(double[] refitted, double[] searched)
    {
        if (refitted.Length != searched.Length)
        {
            return double.PositiveInfinity;
        }

        double largest = 0;
        for (int i = 0; i < refitted.Length; i++)
        {
            double difference = Math.Abs(refitted[i] - searched[i]) / Math.Max(1, Math.Abs(searched[i]));
            largest = double.IsNaN(difference) ? double.PositiveInfinity : Math.Max(largest, difference);
        }

        return largest;
    }

    /// <summary>Model files of earlier blends that this record no longer names are deleted, so a folder holds one blend's models.</summary>
    private static void RemoveUnused(string outDir, KeptModels kept)
    {
        if (!Directory.Exists(KeptModelFiles.FolderIn(outDir)))
        {
            return;
        }

        var named = kept.Members.Select(m => m.Hash + ".fwm").ToHashSet(StringComparer.Ordinal);
        foreach (string file in Directory.EnumerateFiles(KeptModelFiles.FolderIn(outDir), "*.fwm"))
        {
            if (!named.Contains(Path.GetFileName(file)))
            {
                File.Delete(file);
            }
        }
    }

    private sealed record Refit(IReadOnlyList<byte[]> Models, double Difference);

    private sealed class NotKeptException(string message) : Exception(message);
}
