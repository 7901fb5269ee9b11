using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Cluster.Hosting;
using Foldwise.Cluster.Workers;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;
using Microsoft.Extensions.DependencyInjection;
using Orleans.Configuration;
using Orleans.TestingHost;

namespace Foldwise.Cluster.Tests;

/// <summary>
/// A coordinator silo with one slot and a worker silo with one slot (coordinator grains excluded there),
/// started once for the test collection.
/// </summary>
public sealed class TwoSiloCluster : IAsyncLifetime
{
    public MeanLearner Learner { get; } = new(FamilyNames.LightGbm);

    public InProcessTestCluster Cluster { get; private set; } = null!;

    public string CacheDirectory { get; } = Path.Combine(Path.GetTempPath(), "foldwise-cluster-tests", Guid.NewGuid().ToString("N"));

    private int configured;

    public IServiceProvider Coordinator => Cluster.Silos.Single(s => s.ServiceProvider.GetService<SessionRegistry>() is not null).ServiceProvider;

    public IServiceProvider Worker => Cluster.Silos.Single(s => s.ServiceProvider.GetService<SessionRegistry>() is null).ServiceProvider;

    public async Task InitializeAsync()
    {
        var builder = new InProcessTestClusterBuilder(2);
        builder.ConfigureSiloHost((options, host) =>
        {
            // The first silo configured is the cluster's primary: it plays the coordinator.
            bool primary = Interlocked.Increment(ref configured) == 1;
            var worker = new WorkerOptions
            {
                Name = primary ? "coordinator" : "worker",
                Slots = 1,
                ThreadsPerSlot = 1,
                PollInterval = TimeSpan.FromMilliseconds(20),
                CacheDirectory = Path.Combine(CacheDirectory, options.SiloName),
            };
            host.Services.AddFoldwiseWorker(worker, Learner);
            if (primary)
            {
                host.Services.AddFoldwiseCoordinator();
            }
            else
            {
                host.Services.ExcludeCoordinatorGrains();
            }
        });
        // The client's view of which silo hosts which grain refreshes once a minute by default; the wait below needs it sooner.
        builder.ConfigureClient(client => client.Services.Configure<TypeManagementOptions>(o => o.TypeMapRefreshInterval = TimeSpan.FromSeconds(1)));
        Cluster = builder.Build();
        await Cluster.DeployAsync();
        await WaitUntilClientResolvesCoordinatorGrainsAsync();

        // Tests expect both silos to take trials (and assert it); warm up on tables of their own so no test's fetch counts change.
        Learner.Delay = TimeSpan.FromMilliseconds(50);
        await SearchSessions.RunUntilTheWorkerTakesPartAsync(this, "warm-up", SearchSessions.Tables(trainRows: 24, testRows: 8));
        Learner.Delay = TimeSpan.Zero;
    }

    /// <summary>
    /// The client may be attached to the worker silo's gateway, whose cluster manifest learns the coordinator's
    /// grain types a moment after start-up (the client then learns them at its next refresh); until then GetGrain throws "Could not find an implementation".
    /// </summary>
    private async Task WaitUntilClientResolvesCoordinatorGrainsAsync()
    {
        var deadline = DateTime.UtcNow + TimeSpan.FromSeconds(30);
        while (true)
        {
            try
            {
                _ = Cluster.Client.GetGrain<ISearchGrain>("ready");
                _ = Cluster.Client.GetGrain<ISearchBoardGrain>(0);
                return;
            }
            catch (ArgumentException) when (DateTime.UtcNow < deadline)
            {
                await Task.Delay(100);
            }
        }
    }

    public async Task DisposeAsync()
    {
        await Cluster.StopAllSilosAsync();
        await Cluster.DisposeAsync();
        if (Directory.Exists(CacheDirectory))
        {
            Directory.Delete(CacheDirectory, recursive: true);
        }
    }
}

[CollectionDefinition(Name)]
public sealed class TwoSiloCollection : ICollectionFixture<TwoSiloCluster>
{
    public const string Name = "two silos";
}
