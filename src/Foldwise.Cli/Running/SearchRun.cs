using Foldwise.Cli.Output;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Storage;
using Spectre.Console;

namespace Foldwise.Cli.Running;

/// <summary>
/// Runs a search from start (or from its store) to the prediction file: store, embedded cluster, progress,
/// then the blend. A first Ctrl-C stops new trials and lets running ones finish; a second abandons them.
/// </summary>
public sealed class SearchRun(IAnsiConsole console)
{
    /// <summary>How the coordinator's silo is reached (ports, advertised address, certificate). Default: a cluster of one.</summary>
    public ClusterRole Role { get; init; } = new();

    /// <summary>Lease rules for this run's coordinator. Default: <see cref="CoordinatorOptions"/>' defaults.</summary>
    public CoordinatorOptions? Leases { get; init; }

    public async Task<int> RunNewAsync(SearchDefinition definition, string outDir, int slots, int? threads, CancellationToken cancellation)
    {
        string storePath = StoreFile.PathIn(outDir);
        if (File.Exists(storePath) && !DiscardUnstarted(storePath))
        {
            throw new InputException(storePath, "a search is already stored here; continue it with 'foldwise resume' or choose another --out");
        }

        var prepared = SearchPreparation.Prepare(definition, console);
        definition = prepared.Definition;
        Directory.CreateDirectory(outDir);
        TableFiles.Write(outDir, prepared.TrainHash, prepared.TrainBytes);
        TableFiles.Write(outDir, prepared.TestHash, prepared.TestBytes);
        using var store = SearchStore.Create(storePath);
        var header = new SearchHeader
        {
            SearchId = $"{definition.Name}-{DateTimeOffset.UtcNow:yyyyMMddHHmmss}",
            DefinitionJson = DefinitionWriter.Write(definition),
            Folds = prepared.Folds,
            TrainHash = prepared.TrainHash,
            TestHash = prepared.TestHash,
            TrainIds = prepared.Train.Ids,
            TestIds = prepared.Test.Ids,
            TrainTarget = prepared.Train.Target,
            Created = DateTimeOffset.UtcNow,
        };
        store.SaveHeader(header);
        store.SaveScreening(prepared.Screening);
        return await RunAsync(store, header, definition, prepared.Train, prepared.Test, prepared.TrainBytes, prepared.TestBytes, outDir, slots, threads, cancellation);
    }

    /// <summary>
    /// Continues a stored search: done trials stay as they are, running ones are queued again, and the trial and
    /// hour budgets go on from what was spent. A finished search is left alone unless <paramref name="reblend"/>.
    /// </summary>
    public async Task<int> ResumeAsync(string storeOrFolder, int slots, int? threads, bool reblend, CancellationToken cancellation)
    {
        string storePath = Path.GetFullPath(StoreFile.Resolve(storeOrFolder));
        string outDir = Path.GetDirectoryName(storePath)!;
        using var store = SearchStore.Open(storePath);
        var header = store.LoadHeader() ?? throw new StoreException($"{storePath} holds no search header: it was stopped before its first record, so no trial ran. Start it again with 'foldwise run' (the same --out works).");
        var definition = DefinitionReader.ParseStored(header.DefinitionJson, storePath, outDir);
        if (header.Finished)
        {
            string predictions = Path.Combine(outDir, BlendStep.PredictionFileName);
            if (!reblend)
            {
                console.MarkupLine($"Search [bold]{Markup.Escape(header.SearchId)}[/] finished already; its predictions are in [bold]{Markup.Escape(predictions)}[/]. " +
                                   "Nothing to resume ('--blend' blends its trials again).");
                return ExitCodes.Ok;
            }

            BlendStep.Run(store, header, definition, outDir, console, abandon: cancellation);
            return ExitCodes.Ok;
        }

        var (train, trainBytes) = TableFiles.Read(outDir, header.TrainHash, "training");
        var (test, testBytes) = TableFiles.Read(outDir, header.TestHash, "test");
        var before = store.LoadTrials();
        console.MarkupLine($"Resuming [bold]{Markup.Escape(header.SearchId)}[/]: {before.Count(t => t.State == TrialState.Done)} trial(s) done, " +
                           $"{before.Count(t => t.State is TrialState.Running or TrialState.Queued)} to run again, " +
                           $"{TimeSpan.FromSeconds(header.SpentSeconds):hh\\:mm\\:ss} spent before.");
        return await RunAsync(store, header, definition, train, test, trainBytes, testBytes, outDir, slots, threads, cancellation);
    }

    /// <summary>
    /// A store without a header was killed between its creation and its first record: no trial ever ran, so
    /// <c>run</c> may start over it. Returns false (keep it) for anything else, including a file that is no store.
    /// </summary>
    private static bool DiscardUnstarted(string storePath)
    {
        try
        {
            using (var store = SearchStore.Open(storePath))
            {
                if (store.LoadHeader() is not null)
                {
                    return false;
                }
            }
        }
        catch (StoreException)
        {
            return false;
        }

        File.Delete(storePath);
        File.Delete(Path.Combine(Path.GetDirectoryName(storePath)!, Path.GetFileNameWithoutExtension(storePath) + "-log" + Path.GetExtension(storePath)));
        return true;
    }

    internal async Task<int> RunAsync(
        SearchStore store,
        SearchHeader header,
        SearchDefinition definition,
        FeatureTable train,
        FeatureTable test,
        byte[] trainBytes,
        byte[] testBytes,
        string outDir,
        int slots,
        int? threads,
        CancellationToken cancellation)
    {
        var history = store.LoadTrials();
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), store, TimeProvider.System, Leases, history, header.SpentSeconds);
        var manifest = new SearchManifest(
            header.SearchId, header.TrainHash, header.TestHash, header.Folds.FoldCount, header.Folds.Seed, [.. header.Folds.FoldOfRow], definition.Metric.ToString());
        var session = new CoordinatorSession(manifest, coordinator, store);

        using var stopping = new StopSignal(console);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(cancellation, stopping.Abandon);
        stopping.StopRequested += coordinator.RequestStop;

        console.MarkupLine($"Search [bold]{Markup.Escape(header.SearchId)}[/]: {DefinitionWords.Of(definition.Schedule.Kind)} with {DefinitionWords.Of(definition.Schedule.Proposer)}, " +
                           $"{string.Join(" + ", definition.Families.Select(f => f.Family))}, {definition.Folds}-fold, {slots} local slot(s)");
        try
        {
            await using var cluster = await EmbeddedCluster.StartAsync(Role, slots, threads, linked.Token);
            cluster.Shelf.Put(header.TrainHash, trainBytes);
            cluster.Shelf.Put(header.TestHash, testBytes);
            cluster.LocalTables?.Seed(header.TrainHash, train);
            cluster.LocalTables?.Seed(header.TestHash, test);
            cluster.Sessions.Add(session);
            await new ProgressView(console).FollowAsync(session, definition, linked.Token);
        }
        catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
        {
            // Also while the cluster is still starting: a second Ctrl-C then abandons before any trial ran.
            store.UpdateSpent(coordinator.Progress().SpentSeconds, finished: false);
            console.MarkupLine("[yellow]Abandoned: running trials go back to the queue; 'foldwise resume' continues the search.[/]");
            return ExitCodes.Interrupted;
        }

        if (session.StoreFault is { } fault)
        {
            console.MarkupLine($"[red]Stopped: the store in {Markup.Escape(outDir)} refused a write ({Markup.Escape(fault)}). Every trial committed before is kept; " +
                               $"free space, then 'foldwise resume {Markup.Escape(outDir)}' continues the search.[/]");
            return ExitCodes.Failed;
        }

        var progress = coordinator.Progress();
        store.UpdateSpent(progress.SpentSeconds, finished: false);
        if (progress.Done == 0)
        {
            console.MarkupLine("[red]No trial finished, so there is nothing to blend.[/]");
            return ExitCodes.Failed;
        }

        try
        {
            BlendStep.Run(store, header, definition, outDir, console, abandon: stopping.Abandon);
        }
        catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
        {
            // The search stays unfinished: 'resume' blends it (after any trials its budget still allows).
            console.MarkupLine($"[yellow]Abandoned the blend: every trial is stored, the prediction file was not written. 'foldwise blend {Markup.Escape(outDir)}' blends them.[/]");
            return ExitCodes.Interrupted;
        }

        store.UpdateSpent(progress.SpentSeconds, finished: progress.Stopping != StopReason.Requested);
        return ExitCodes.Ok;
    }
}
