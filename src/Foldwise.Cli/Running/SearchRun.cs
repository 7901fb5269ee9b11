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
        if (File.Exists(storePath))
        {
            throw new InputException(storePath, "a search is already stored here; continue it with 'foldwise resume' or choose another --out");
        }

        var prepared = SearchPreparation.Prepare(definition, console);
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

        console.MarkupLine($"Search [bold]{Markup.Escape(header.SearchId)}[/]: {definition.Schedule.Kind} with {definition.Schedule.Proposer}, " +
                           $"{string.Join(" + ", definition.Families.Select(f => f.Family))}, {definition.Folds}-fold, {slots} local slot(s)");
        await using (var cluster = await EmbeddedCluster.StartAsync(Role, slots, threads, linked.Token))
        {
            cluster.Shelf.Put(header.TrainHash, trainBytes);
            cluster.Shelf.Put(header.TestHash, testBytes);
            cluster.LocalTables?.Seed(header.TrainHash, train);
            cluster.LocalTables?.Seed(header.TestHash, test);
            cluster.Sessions.Add(session);
            try
            {
                await new ProgressView(console).FollowAsync(session, definition, linked.Token);
            }
            catch (OperationCanceledException) when (stopping.Abandon.IsCancellationRequested)
            {
                store.UpdateSpent(coordinator.Progress().SpentSeconds, finished: false);
                console.MarkupLine("[yellow]Abandoned: running trials go back to the queue; 'foldwise resume' continues the search.[/]");
                return ExitCodes.Interrupted;
            }
        }

        var progress = coordinator.Progress();
        store.UpdateSpent(progress.SpentSeconds, finished: false);
        if (progress.Done == 0)
        {
            console.MarkupLine("[red]No trial finished, so there is nothing to blend.[/]");
            return ExitCodes.Failed;
        }

        BlendStep.Run(store, header, definition, outDir, console);
        store.UpdateSpent(progress.SpentSeconds, finished: progress.Stopping != StopReason.Requested);
        return ExitCodes.Ok;
    }
}
