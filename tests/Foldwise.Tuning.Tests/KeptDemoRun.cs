using Foldwise.Testing.Fakes;

namespace Foldwise.Tuning.Tests;

/// <summary>
/// One run of <see cref="QuickDemo"/> under its own search name, shared by <see cref="KeptModelsTests"/>: its search id
/// never equals that of a <see cref="QuickDemoRun"/> started in the same second, whose span tests select by id.
/// </summary>
public sealed class KeptDemoRun : IAsyncLifetime, IDisposable
{
    private readonly TempFolder folder = new();

    public SyncEvents Events { get; } = new();

    public SearchResult Result { get; private set; } = null!;

    /// <summary>The test table the search scored, as a CSV file.</summary>
    public string TestCsv => folder.PathOf("test.csv");

    public async Task InitializeAsync()
    {
        var definition = QuickDemo.WriteTo(folder.Root) with { Name = "kept" };
        Result = await new SearchRun(Events).RunNewAsync(definition, folder.PathOf("out"), slots: 1, threads: 1, SearchStopping.Never);
    }

    public Task DisposeAsync() => Task.CompletedTask;

    public void Dispose() => folder.Dispose();
}
