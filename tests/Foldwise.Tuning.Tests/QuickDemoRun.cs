using System.Diagnostics;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Search;
using Foldwise.Storage;
using Foldwise.Testing.Fakes;
using OpenTelemetry.Trace;

namespace Foldwise.Tuning.Tests;

/// <summary>One run of <see cref="QuickDemo"/> through the search use case (one slot of one thread, spans to memory), shared by a test class.</summary>
public sealed class QuickDemoRun : IAsyncLifetime, IDisposable
{
    /// <summary>
    /// The test classes that read this run share one instance: one search, not one per class (searches of the same
    /// name started in the same second share a search id, so their traces could not be told apart).
    /// </summary>
    public const string Collection = "quick demo run";

    private readonly TempFolder folder = new();

    public SyncEvents Events { get; } = new();

    /// <summary>Every span ended while the run's telemetry listened (other tests' spans too: filter by trace).</summary>
    public List<Activity> Spans { get; } = [];

    public SearchResult Result { get; private set; } = null!;

    public IReadOnlyList<TrialRecord> Trials { get; private set; } = [];

    public async Task InitializeAsync()
    {
        var definition = QuickDemo.WriteTo(folder.Root);
        string outDir = folder.PathOf("out");
        var telemetry = new FoldwiseTelemetryOptions { Tracing = t => t.AddInMemoryExporter(Spans) };
        Result = await new SearchRun(Events) { Telemetry = telemetry }.RunNewAsync(definition, outDir, slots: 1, threads: 1, SearchStopping.Never);
        using var store = SearchStore.OpenReadOnly(StoreFile.PathIn(outDir));
        Trials = [.. store.LoadTrials().OrderBy(t => t.Id)];
    }

    public Task DisposeAsync() => Task.CompletedTask;

    public void Dispose() => folder.Dispose();
}

[CollectionDefinition(QuickDemoRun.Collection)]
public sealed class QuickDemoRunCollection : ICollectionFixture<QuickDemoRun>;
