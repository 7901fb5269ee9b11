using System.Collections.Immutable;
using System.Security.Cryptography;
using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;

namespace Foldwise.Cluster.Tests;

[Trait(Lane.Key, Lane.Slow)]
[Collection(TwoSiloCollection.Name)]
public sealed class DistributedSearchTests(TwoSiloCluster fixture)
{
    [Fact]
    public async Task Runs_every_trial_exactly_once_across_both_silos_and_ships_the_tables_by_hash()
    {
        // Given a search of 12 trials on a coordinator silo and a worker silo, each with one slot, on tables no other test uses
        var tables = SearchSessions.Tables(trainRows: 36, testRows: 12);
        var train = tables.Train;
        var recorder = new MemoryRecorder();
        int fetchedBefore = fixture.Worker.GetRequiredService<TableCache>().Fetches;
        var session = SearchSessions.Start(fixture, "ship", tables, trials: 12, recorder);
        fixture.Learner.Delay = TimeSpan.FromMilliseconds(40);

        // When the search runs to its budget
        await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));
        fixture.Coordinator.GetRequiredService<SessionRegistry>().Remove(session.SearchId);

        // Then every trial is done once, with its vectors, and both machines took part
        var trials = recorder.Latest();
        Assert.Equal(Enumerable.Range(1, 12), trials.Select(t => t.Id));
        Assert.All(trials, t => Assert.Equal(TrialState.Done, t.State));
        Assert.All(trials, t => Assert.True(recorder.Vectors.ContainsKey(t.Id)));
        Assert.All(trials, t => Assert.Equal(train.RowCount, recorder.Vectors[t.Id].OutOfFold.Length));
        Assert.Contains(trials, t => t.Worker == "worker");
        Assert.Contains(trials, t => t.Worker == "coordinator");
        // The worker fetched the two tables over the grain path, verified by hash
        Assert.Equal(fetchedBefore + 2, fixture.Worker.GetRequiredService<TableCache>().Fetches);
    }

    [Fact]
    public async Task A_worker_holds_only_its_latest_search_s_data_and_no_table()
    {
        // Given a worker that served a search on its own tables
        var worker = fixture.Worker;
        await SearchSessions.RunUntilTheWorkerTakesPartAsync(fixture, "earlier", SearchSessions.Tables(trainRows: 33, testRows: 11));

        // When it serves the next search, on other tables
        var next = SearchSessions.Tables(trainRows: 39, testRows: 13);
        var (latest, recorder) = await SearchSessions.RunUntilTheWorkerTakesPartAsync(fixture, "latest", next);

        // Then it holds the latest search's data only, not the earlier one's, and no table in memory: the data is built
        // from the tables, which stay in its disk cache
        Assert.Contains(recorder.Latest(), t => t.Worker == "worker");
        Assert.Equal([latest.SearchId], worker.GetRequiredService<TrialDataCache>().Held);
        Assert.Empty(worker.GetRequiredService<TableCache>().Held);
        Assert.True(File.Exists(Path.Combine(worker.GetRequiredService<WorkerOptions>().CacheDirectory, TableHash.Of(next.Train) + CacheFolder.Extension)));
    }

    [Fact]
    public async Task Reports_progress_through_the_search_grain()
    {
        var recorder = new MemoryRecorder();
        var session = SearchSessions.Start(fixture, "progress", SearchSessions.Tables(), trials: 3, recorder);
        await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));

        var progress = await fixture.Cluster.Client.GetGrain<ISearchGrain>(session.SearchId).GetProgressAsync();
        fixture.Coordinator.GetRequiredService<SessionRegistry>().Remove(session.SearchId);

        Assert.True(progress.Finished);
        Assert.Equal(3, progress.Done);
        Assert.Equal("TrialBudget", progress.Stopping);
        Assert.True(progress.BestByFamily.ContainsKey(FamilyNames.LightGbm));
    }


}
