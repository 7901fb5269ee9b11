using System.Text.Json;

namespace Foldwise.Cli.Tests;

public sealed class PlanCommandTests
{
    [Fact]
    public void Prints_the_published_hyperband_table_for_81_rounds_and_eta_3()
    {
        var plan = CliHarness.Run("plan", "--min-budget", "1", "--max-budget", "81", "--eta", "3", "--json");

        // Hyperband bracket table, R=81, eta=3 — Li et al., JMLR 18(185), 2018, Table 1: (n_i, r_i) per bracket
        int[][][] published =
        [
            [[81, 1], [27, 3], [9, 9], [3, 27], [1, 81]],
            [[34, 3], [11, 9], [3, 27], [1, 81]],
            [[15, 9], [5, 27], [1, 81]],
            [[8, 27], [2, 81]],
            [[5, 81]],
        ];
        Assert.Equal(0, plan.ExitCode);
        using var json = JsonDocument.Parse(plan.Output);
        var brackets = json.RootElement.GetProperty("hyperband").EnumerateArray()
            .Select(b => b.GetProperty("rungs").EnumerateArray().Select(r => new[] { r.GetProperty("candidates").GetInt32(), r.GetProperty("budget").GetInt32() }).ToArray())
            .ToArray();
        Assert.Equal(published, brackets);
        Assert.Equal([1, 3, 9, 27, 81], json.RootElement.GetProperty("asha_rungs").EnumerateArray().Select(r => r.GetInt32()));
    }

    [Fact]
    public void Prints_the_plan_as_a_table_a_person_reads()
    {
        var plan = CliHarness.Run("plan", "--min-budget", "25", "--max-budget", "400", "--eta", "3");

        Assert.Equal(0, plan.ExitCode);
        Assert.Contains("ASHA rungs (rounds): 25 → 75 → 225 → 400", plan.Output);
        // √(400/25) = 4, √(400/75) ≈ 2.31, √(400/225) ≈ 1.33, worked by hand.
        Assert.Contains("× the drawn one (default schedule.rate_scaling 0.5; at most 1): 4 → 2.31 → 1.33 → 1.", plan.Output);
        Assert.Contains("each cell: candidates × rounds", plan.Output);
    }

    [Fact]
    public void Refuses_an_eta_below_two()
    {
        var plan = CliHarness.Run("plan", "--eta", "1");

        Assert.Equal(1, plan.ExitCode);
        Assert.Contains("--eta must be at least 2", plan.Output);
    }
}
