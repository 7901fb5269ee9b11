using Foldwise.Testing;
namespace Foldwise.Cli.Tests.Processes;

[Trait(Lane.Key, Lane.Slow)]
public sealed class FoldwiseProcessTests
{
    [Fact]
    public async Task Runs_foldwise_as_a_child_process_and_reads_its_exit_code()
    {
        using var plan = FoldwiseProcess.Start("plan", "--first-rung", "1", "--full-budget", "9", "--eta", "3");

        int code = await plan.WaitForExitAsync(TimeSpan.FromSeconds(60));

        Assert.Equal(0, code);
        Assert.Contains(plan.Lines, l => l.Contains("ASHA rungs (rounds): 1 → 3 → 9", StringComparison.Ordinal));
    }
}
