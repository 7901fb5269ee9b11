using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Search;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;

namespace Foldwise.Cluster.Tests;

/// <summary>Each test builds its own two-silo cluster, because it kills or inspects silos.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class LostSiloTests
{
    [Fact]
    public async Task Requeues_the_trial_of_a_killed_worker_silo_after_its_lease_expires_and_the_coordinator_silo_finishes_it()
    {
        // Given a search with 1 s leases whose trials take ~0.6 s, on a coordinator silo and a worker silo
        var cluster = new TwoSiloCluster();
        await cluster.InitializeAsync();
        try
        {
            cluster.Learner.Delay = TimeSpan.FromMilliseconds(200);
            var recorder = new MemoryRecorder();
            var leases = new CoordinatorOptions { LeaseDuration = TimeSpan.FromSeconds(1) };
            var session = SearchSessions.Start(cluster, "lost", SearchSessions.Tables(), trials: 8, recorder, leases);

            // When the worker silo is killed while it holds a lease
            var deadline = DateTime.UtcNow.AddSeconds(30);
            while (!session.Coordinator.Trials().Any(t => t.State == TrialState.Running && t.Worker == "worker") && DateTime.UtcNow < deadline)
            {
                await Task.Delay(10);
            }

            int lostTrial = session.Coordinator.Trials().First(t => t.State == TrialState.Running && t.Worker == "worker").Id;
            var workerSilo = cluster.Cluster.Silos.Single(s => s.ServiceProvider.GetService<SessionRegistry>() is null);
            await cluster.Cluster.KillSiloAsync(workerSilo);
            await session.Finished.WaitAsync(TimeSpan.FromSeconds(60));

            // Then every trial is done once; the killed one after a lost attempt, by the coordinator's slot
            var trials = recorder.Latest();
            Assert.Equal(Enumerable.Range(1, 8), trials.Select(t => t.Id));
            Assert.All(trials, t => Assert.Equal(TrialState.Done, t.State));
            var lost = trials.Single(t => t.Id == lostTrial);
            Assert.Contains(lost.LostAttempts, a => a.Contains("lease expired on worker", StringComparison.Ordinal));
            Assert.Equal("coordinator", lost.Worker);
            Assert.Equal(2, lost.Attempt);
        }
        finally
        {
            await cluster.DisposeAsync();
        }
    }

    [Fact]
    public async Task A_later_search_on_the_same_tables_fetches_nothing_again()
    {
        // Given a worker silo that has run trials of a search on two tables
        var cluster = new TwoSiloCluster();
        await cluster.InitializeAsync();
        cluster.Learner.Delay = TimeSpan.FromMilliseconds(50);
        try
        {
            var tables = SearchSessions.Tables();
            var cache = cluster.Worker.GetRequiredService<TableCache>();
            int fetchedBefore = cache.Fetches;
            var first = await SearchSessions.RunUntilTheWorkerTakesPartAsync(cluster, "first", tables);
            int fetchedOnce = cache.Fetches;

            // When a second search on the same tables runs, and a fresh process's cache reads the same folder
            var (second, recorder) = await SearchSessions.RunUntilTheWorkerTakesPartAsync(cluster, "second", tables);
            var options = cluster.Worker.GetRequiredService<WorkerOptions>();
            var fresh = new TableCache(cluster.Worker.GetRequiredService<IGrainFactory>(), options);
            var reread = await fresh.GetAsync(second.Manifest.TrainHash, CancellationToken.None);

            // Then the worker took part in both, fetched the tables once, and the disk copy serves a new process
            Assert.Contains(first.Recorder.Latest(), t => t.Worker == "worker");
            Assert.Equal(fetchedBefore + 2, fetchedOnce);
            Assert.Contains(recorder.Latest(), t => t.Worker == "worker");
            Assert.Equal(fetchedOnce, cache.Fetches);
            Assert.Equal(0, fresh.Fetches);
            Assert.Equal(tables.Train.RowCount, reread.RowCount);
        }
        finally
        {
            await cluster.DisposeAsync();
        }
    }
}
