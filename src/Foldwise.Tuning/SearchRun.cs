using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Blending;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Learning;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Learners;
using Foldwise.Storage;

namespace Foldwise.Tuning;

/// <summary>
/// The search use case from start (or from its store) to the prediction file: prepare the tables, store the search,
/// host the embedded cluster, run the trials, blend. It returns a <see cref="SearchResult"/> and reports what happens
/// on the way as <see cref="SearchEvent"/>s; it writes to no console.
/// </summary>
/// <param name="events">
/// Receives every event, synchronously, on the thread where it happens (Orleans' threads for trials). A push sink
/// rather than an <c>IAsyncEnumerable</c>: trial events are raised inside the coordinator's lock by grains, so they
/// must neither wait for a reader nor be buffered without bound, and the run's result stays a plain return value.
/// </param>
public sealed class SearchRun(IProgress<SearchEvent> events)
{
    /// <summary>How the coordinator's silo is reached (ports, advertised address, certificate). Default: a cluster of one.</summary>
    public ClusterRole Role { get; init; } = new();

    /// <summary>Lease rules for this run's coordinator. Default: <see cref="CoordinatorOptions"/>' defaults.</summary>
    public CoordinatorOptions? Leases { get; init; }

    /// <summary>Where the search's traces and metrics go. Default: nowhere.</summary>
    public FoldwiseTelemetryOptions Telemetry { get; init; } = new();

    /// <summary>
    /// The learners the coordinator's own slots train. Default: <see cref="LearnerCatalog.BuiltIn"/>. No command sets
    /// it; a bench swaps in a reference learner here. Workers and the blend's re-fit of its members use the built-in ones.
    /// </summary>
    public ILearnerCatalog Learners { get; init; } = LearnerCatalog.BuiltIn;

    public async Task<SearchResult> RunNewAsync(SearchDefinition definition, string outDir, int slots, int? threads, SearchStopping stopping, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(definition);
        string storePath = StoreFile.PathIn(outDir);
        if (File.Exists(storePath) && !UnstartedStore.Discard(storePath))
        {
            throw new InputException(storePath, "a search is already stored here; continue it with 'foldwise resume' or choose another --out");
        }

        var prepared = SearchPreparation.Prepare(definition, events);
        definition = prepared.Definition;
        Directory.CreateDirectory(outDir);
        string trainHash = TableFiles.Write(outDir, prepared.Train, ProgressPacer.For(PreparationStep.Writing, "the screened training table", events).Tick);
        string testHash = TableFiles.Write(outDir, prepared.Test, ProgressPacer.For(PreparationStep.Writing, "the screened test table", events).Tick);
        using var store = SearchStore.Create(storePath);
        var header = new SearchHeader
        {
            SearchId = $"{definition.Name}-{DateTimeOffset.UtcNow:yyyyMMddHHmmss}",
            Definition = definition,
            Folds = prepared.Folds,
            TrainHash = trainHash,
            TestHash = testHash,
            TrainIds = prepared.Train.Ids,
            TestIds = prepared.Test.Ids,
            TrainTarget = prepared.Train.Target,
            Created = DateTimeOffset.UtcNow,
        };
        store.SaveHeader(header);
        store.SaveScreening(prepared.Screening);
        return await RunAsync(store, header, definition, prepared.Train, prepared.Test, outDir, slots, threads, stopping, cancellation);
    }

    /// <summary>
    /// Continues a stored search: done trials stay as they are, running ones are queued again, and the trial and
    /// hour budgets go on from what was spent. A finished search is left alone unless <paramref name="reblend"/>.
    /// </summary>
    public async Task<SearchResult> ResumeAsync(string storeOrFolder, int slots, int? threads, bool reblend, SearchStopping stopping, CancellationToken cancellation = default)
    {
        ArgumentNullException.ThrowIfNull(stopping);
        string storePath = Path.GetFullPath(StoreFile.Resolve(storeOrFolder));
        string outDir = Path.GetDirectoryName(storePath)!;
        using var store = SearchStore.Open(storePath);
        var header = store.LoadHeader() ?? throw new StoreException($"{storePath} holds no search header: it was stopped before its first record, so no trial ran. Start it again with 'foldwise run' (the same --out works).");
        var definition = header.Definition;
        if (header.Finished)
        {
            if (!reblend)
            {
                return new SearchResult(SearchEnding.AlreadyFinished, header.SearchId, outDir, null);
            }

            var blend = BlendStep.Run(store, header, definition, outDir, events, abandon: cancellation);
            return new SearchResult(SearchEnding.Blended, header.SearchId, outDir, blend);
        }

        var train = TableFiles.Read(outDir, header.TrainHash, "training");
        var test = TableFiles.Read(outDir, header.TestHash, "test");
        var before = store.LoadTrials();
        events.Report(new SearchResumed(
            header.SearchId,
            before.Count(t => t.State == TrialState.Done),
            before.Count(t => t.State is TrialState.Running or TrialState.Queued),
            TimeSpan.FromSeconds(header.SpentSeconds)));
        return await RunAsync(store, header, definition, train, test, outDir, slots, threads, stopping, cancellation);
    }

    internal async Task<SearchResult> RunAsync(
        SearchStore store,
        SearchHeader header,
        SearchDefinition definition,
        FeatureTable train,
        FeatureTable test,
        string outDir,
        int slots,
        int? threads,
        SearchStopping stopping,
        CancellationToken cancellation)
    {
        var history = store.LoadTrials();
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), store, TimeProvider.System, Leases, history, header.SpentSeconds);
        var manifest = new SearchManifest(
            header.SearchId, header.TrainHash, header.TestHash, header.Folds.FoldCount, header.Folds.Seed, [.. header.Folds.FoldOfRow], definition.Metric.ToString(),
            [.. definition.LevelCodeFamilies()]);

        using var linked = CancellationTokenSource.CreateLinkedTokenSource(cancellation, stopping.Abandon);
        using var stopRegistration = stopping.Stop.Register(coordinator.RequestStop);

        events.Report(new SearchStarted(header.SearchId, definition, slots));
        EmbeddedCluster cluster;
        try
        {
            cluster = await EmbeddedCluster.StartAsync(Role, slots, threads, Learners, Telemetry, events, linked.Token);
        }
        catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
        {
            // A second Ctrl-C while the cluster is still starting abandons before any trial ran.
            store.UpdateSpent(coordinator.Progress().SpentSeconds, finished: false);
            return new SearchResult(SearchEnding.Abandoned, header.SearchId, outDir, null);
        }

        // The cluster (and with it the telemetry's exporters) lives until the blend is done: the search's span
        // opens once they listen and parents every trial, on whichever machine, and the blend.
        await using (cluster)
        {
            var span = new SearchSpan(header.SearchId, definition.Name);
            try
            {
                return await RunTrialsAndBlendAsync(store, header, definition, coordinator, manifest, cluster, span, train, test, outDir, stopping, linked.Token);
            }
            finally
            {
                span.End(coordinator.Progress());
            }
        }
    }

    private async Task<SearchResult> RunTrialsAndBlendAsync(
        SearchStore store,
        SearchHeader header,
        SearchDefinition definition,
        SearchCoordinator coordinator,
        SearchManifest manifest,
        EmbeddedCluster cluster,
        SearchSpan span,
        FeatureTable train,
        FeatureTable test,
        string outDir,
        SearchStopping stopping,
        CancellationToken abandon)
    {
        try
        {
            cluster.Shelf.Put(header.TrainHash, TableFiles.PathOf(outDir, header.TrainHash));
            cluster.Shelf.Put(header.TestHash, TableFiles.PathOf(outDir, header.TestHash));
            cluster.LocalTables?.Seed(header.TrainHash, train);
            cluster.LocalTables?.Seed(header.TestHash, test);
            var session = new CoordinatorSession(manifest, coordinator, store, events, span.Context);
            cluster.Sessions.Add(session);
            await session.Finished.WaitAsync(abandon);
            if (session.StoreFault is { } fault)
            {
                // The store refused a write: nothing more is written, what it committed before stays for 'resume'.
                return new SearchResult(SearchEnding.StoreFailed, header.SearchId, outDir, null) { StoreFault = fault };
            }

            events.Report(new SearchStopped(header.SearchId, coordinator.Progress()));
        }
        catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
        {
            store.UpdateSpent(coordinator.Progress().SpentSeconds, finished: false);
            return new SearchResult(SearchEnding.Abandoned, header.SearchId, outDir, null);
        }

        var progress = coordinator.Progress();
        store.UpdateSpent(progress.SpentSeconds, finished: false);
        if (progress.Done == 0)
        {
            return new SearchResult(SearchEnding.NothingDone, header.SearchId, outDir, null);
        }

        BlendSummary blend;
        try
        {
            blend = BlendStep.Run(store, header, definition, outDir, events, abandon: stopping.Abandon, search: span.Context, tables: new SearchTables(train, test));
        }
        catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
        {
            // The search stays unfinished: 'resume' blends it (after any trials its budget still allows).
            return new SearchResult(SearchEnding.BlendAbandoned, header.SearchId, outDir, null);
        }

        store.UpdateSpent(progress.SpentSeconds, finished: progress.Stopping != StopReason.Requested);
        return new SearchResult(SearchEnding.Blended, header.SearchId, outDir, blend);
    }
}
