using Foldwise.Testing;
namespace Foldwise.Cli.Tests.Resume;

[Trait(Lane.Key, Lane.Slow)]
[Collection(ResumeProcesses.Name)]
public sealed class ReproducibilityTests : IDisposable
{
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public void The_same_definition_and_seed_on_one_slot_give_the_same_trials_and_scores()
    {
        // Given one definition (seed from the definition's default) run twice, into two folders, on one slot
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 10);
        string first = workspace.PathOf("first"), second = workspace.PathOf("second");

        // When both run
        var a = CliHarness.Run("run", definition, "--out", first, "--slots", "1", "--threads", "1");
        var b = CliHarness.Run("run", definition, "--out", second, "--slots", "1", "--threads", "1");

        // Then their histories agree on ids, families, parameters, budgets, rungs, parents and scores, bit for bit
        Assert.True(a.ExitCode == 0, a.Output);
        Assert.True(b.ExitCode == 0, b.Output);
        var firstTrials = StoredTrial.Read(first);
        Assert.Equal(10, firstTrials.Count);
        Assert.Contains(firstTrials, t => t.Parent is not null);
        Assert.Equal(firstTrials, StoredTrial.Read(second));
    }
}
