using System.Diagnostics;
using Foldwise.Cluster.Telemetry;
using Foldwise.Core.Search;
using Foldwise.Storage;
using Foldwise.Testing.Fakes;
using OpenTelemetry.Trace;

namespace Foldwise.Tuning.Tests;

/// <summary>One run of <see cref="QuickDemo"/> through the search use case (one slot of one thread, spans to memory), shared by the test classes of <see cref="QuickDemoCollection"/>.</summary>
public sealed class QuickDemoRun : IAsyncLifetime, IDisposable
{
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
