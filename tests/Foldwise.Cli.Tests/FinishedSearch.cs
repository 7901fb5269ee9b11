namespace Foldwise.Cli.Tests;

/// <summary>One small finished search, run once for a test class that reads or re-blends it.</summary>
public sealed class FinishedSearch : IDisposable
{
    public FinishedSearch()
    {
        Workspace.WriteTables(trainRows: 90, testRows: 15);
        var run = CliHarness.Run("run", Workspace.WriteDefinition(trials: 14), "--out", Workspace.Out);
        if (run.ExitCode != 0)
        {
            throw new InvalidOperationException("the fixture search failed:\n" + run.Output);
        }
    }

    public Workspace Workspace { get; } = new();

    public string Store => Path.Combine(Workspace.Out, "search.db");

    public void Dispose() => Workspace.Dispose();
}
