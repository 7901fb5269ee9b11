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
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;

namespace Foldwise.Cluster.Tests;

[Collection(TwoSiloCollection.Name)]
public sealed class DistributedSearchTests(TwoSiloCluster fixture)
{
    [Fact]
    public async Task Runs_every_trial_exactly_once_across_both_silos_and_ships_the_tables_by_hash()
    {
        // Given a search of 12 trials on a coordinator silo and a worker silo, each with one slot
        var (train, test) = (Table("train", 30, withTarget: true), Table("test", 10, withTarget: false));
        var recorder = new MemoryRecorder();
        var session = StartSession("ship", train, test, trials: 12, recorder);
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
        Assert.True(fixture.Worker.GetRequiredService<TableCache>().Fetches >= 2);
    }

    [Fact]
    public async Task Reports_progress_through_the_search_grain()
    {
        var recorder = new MemoryRecorder();
        var session = StartSession("progress", Table("train", 30, true), Table("test", 5, false), trials: 3, recorder);
        await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));

        var progress = await fixture.Cluster.Client.GetGrain<ISearchGrain>(session.SearchId).GetProgressAsync();
        fixture.Coordinator.GetRequiredService<SessionRegistry>().Remove(session.SearchId);

        Assert.True(progress.Finished);
        Assert.Equal(3, progress.Done);
        Assert.Equal("TrialBudget", progress.Stopping);
        Assert.True(progress.BestByFamily.ContainsKey(FamilyNames.LightGbm));
    }

    private CoordinatorSession StartSession(string name, FeatureTable train, FeatureTable test, int trials, MemoryRecorder recorder)
    {
        var trainBytes = TableCodec.Encode(train);
        var testBytes = TableCodec.Encode(test);
        string trainHash = Convert.ToHexStringLower(SHA256.HashData(trainBytes));
        string testHash = Convert.ToHexStringLower(SHA256.HashData(testBytes));
        var shelf = fixture.Coordinator.GetRequiredService<DatasetShelf>();
        shelf.Put(trainHash, trainBytes);
        shelf.Put(testHash, testBytes);
        var folds = new FoldPlan(3, 1, [.. Enumerable.Range(0, train.RowCount).Select(r => r % 3)]);
        var definition = new SearchDefinition
        {
            Name = name,
            Data = new DataSource("train.csv", "test.csv", "id", "y"),
            Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
            Budget = new SearchBudget(trials, null),
        };
        var coordinator = new SearchCoordinator(definition, new CountingSchedule(), recorder, TimeProvider.System);
        var manifest = new SearchManifest($"{name}-{Guid.NewGuid():N}", trainHash, testHash, 3, 1, [.. folds.FoldOfRow], "Rmsle");
        var session = new CoordinatorSession(manifest, coordinator, recorder);
        fixture.Coordinator.GetRequiredService<SessionRegistry>().Add(session);
        return session;
    }

    private static FeatureTable Table(string name, int rows, bool withTarget)
    {
        var column = new SparseColumn([.. Enumerable.Range(0, rows).Where(r => r % 2 == 0)], [.. Enumerable.Range(0, rows).Where(r => r % 2 == 0).Select(r => (float)r)]);
        return new FeatureTable(
            name,
            [.. Enumerable.Range(0, rows).Select(r => $"{name}{r}")],
            ["f1"],
            [column],
            withTarget ? [.. Enumerable.Range(0, rows).Select(r => (double)r)] : ImmutableArray<double>.Empty);
    }
}
