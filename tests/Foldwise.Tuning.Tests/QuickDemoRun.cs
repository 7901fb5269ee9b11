using Foldwise.Core.Search;
using Foldwise.Storage;
using Foldwise.Testing.Fakes;

namespace Foldwise.Tuning.Tests;

/// <summary>One run of <see cref="QuickDemo"/> through the search use case (one slot of one thread), shared by a test class.</summary>
public sealed class QuickDemoRun : IAsyncLifetime, IDisposable
{
    private readonly TempFolder folder = new();

    public SyncEvents Events { get; } = new();

    public SearchResult Result { get; private set; } = null!;

    public IReadOnlyList<TrialRecord> Trials { get; private set; } = [];

    public async Task InitializeAsync()
    {
        var definition = QuickDemo.WriteTo(folder.Root);
        string outDir = folder.PathOf("out");
        Result = await new SearchRun(Events).RunNewAsync(definition, outDir, slots: 1, threads: 1, SearchStopping.Never);
        using var store = SearchStore.OpenReadOnly(StoreFile.PathIn(outDir));
        Trials = [.. store.LoadTrials().OrderBy(t => t.Id)];
    }

    public Task DisposeAsync() => Task.CompletedTask;

    public void Dispose() => folder.Dispose();
}
