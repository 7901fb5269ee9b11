using System.Text.Json;

namespace Foldwise.Cli.Tests;

public sealed class PlanCommandTests
{
    [Fact]
    public void Prints_the_published_hyperband_table_for_81_rounds_and_eta_3()
    {
        var plan = CliHarness.Run("plan", "--first-rung", "1", "--full-budget", "81", "--eta", "3", "--json");

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
        var plan = CliHarness.Run("plan", "--first-rung", "25", "--full-budget", "400", "--eta", "3");

        Assert.Equal(0, plan.ExitCode);
        Assert.Contains("ASHA rungs (rounds): 25 → 75 → 225 → 400", plan.Output);
        // √(400/25) = 4, √(400/75) ≈ 2.31, √(400/225) ≈ 1.33, worked by hand.
        Assert.Contains("× the drawn one (default schedule.rate_scaling 0.5; at most 1): 4 → 2.31 → 1.33 → 1.", plan.Output);
        Assert.Contains("each cell: candidates × rounds", plan.Output);
    }

    [Fact]
    public void Plans_a_family_in_its_own_unit_and_lists_every_familys_own_rungs()
    {
        var plan = CliHarness.Run("plan", "--family", "forest");

        Assert.Equal(0, plan.ExitCode);
        Assert.Contains("forest, budgets in trees.", plan.Output);
        Assert.Contains("ASHA rungs (trees): 20 → 60 → 180 → 300", plan.Output);
        Assert.Contains("each cell: candidates × trees", plan.Output);
        Assert.Contains("lightgbm: 25 → 75 → 225 → 400 rounds", plan.Output);
        Assert.Contains("linear: 6 → 18 → 50 passes", plan.Output);

        var unknown = CliHarness.Run("plan", "--family", "knn");
        Assert.NotEqual(0, unknown.ExitCode);
        Assert.Contains("--family must be one of lightgbm, fasttree, forest, gam, linear, got 'knn'", unknown.Output);
    }

    [Fact]
    public void Prints_what_each_asha_bracket_costs_and_its_share_of_new_candidates()
    {
        var plan = CliHarness.Run("plan", "--first-rung", "20", "--full-budget", "180", "--eta", "3", "--json");

        // Worked by hand: 20 + 60/3 + 180/9 = 60, 60 + 180/3 = 120, 180; equal compute gives shares 1/60 : 1/120 : 1/180 = 6 : 3 : 2 of 11
        Assert.Equal(0, plan.ExitCode);
        using var json = JsonDocument.Parse(plan.Output);
        var brackets = json.RootElement.GetProperty("asha_brackets").EnumerateArray().ToArray();
        Assert.Equal([20, 60, 180], brackets.Select(b => b.GetProperty("start_budget").GetInt32()));
        Assert.Equal([60.0, 120.0, 180.0], brackets.Select(b => b.GetProperty("mean_rounds").GetDouble()));
        Assert.Equal([Math.Round(6 / 11.0, 4), Math.Round(3 / 11.0, 4), Math.Round(2 / 11.0, 4)], brackets.Select(b => b.GetProperty("share_of_new_candidates").GetDouble()));

        var text = CliHarness.Run("plan", "--first-rung", "20", "--full-budget", "180", "--eta", "3");
        Assert.Contains("bracket 3 starts at 180 rounds, 180 per candidate on average; with all 3, new candidates split 55 % : 27 % : 18 %", text.Output.ReplaceLineEndings(" ").Replace("  ", " "));
    }

    [Fact]
    public void Refuses_an_eta_below_two()
    {
        var plan = CliHarness.Run("plan", "--eta", "1");

        Assert.Equal(ExitCodes.Usage, plan.ExitCode);
        Assert.Contains("--eta must be at least 2", plan.Output);
    }

    [Theory]
    [InlineData("--min-budget", "20", "--first-rung")]
    [InlineData("--max-budget", "180", "--full-budget")]
    public void Refuses_the_retired_budget_options_and_names_their_replacements(string retired, string value, string replacement)
    {
        var plan = CliHarness.Run("plan", retired, value, "--eta", "9");

        Assert.Equal(ExitCodes.Usage, plan.ExitCode);
        Assert.Contains($"{retired} is a retired name; did you mean {replacement}?", plan.Output);
    }

    [Fact]
    public void Numbers_hyperband_brackets_from_one_with_their_halvings_beside_them()
    {
        var plan = CliHarness.Run("plan", "--first-rung", "1", "--full-budget", "9", "--eta", "3", "--json");

        // s_max = 2 for R = 9, η = 3: brackets 1, 2, 3 halve 2, 1 and 0 times (Li et al., JMLR 18(185), 2018, Algorithm 1)
        using var json = JsonDocument.Parse(plan.Output);
        var brackets = json.RootElement.GetProperty("hyperband").EnumerateArray().ToArray();
        Assert.Equal([1, 2, 3], brackets.Select(b => b.GetProperty("bracket").GetInt32()));
        Assert.Equal([2, 1, 0], brackets.Select(b => b.GetProperty("halvings").GetInt32()));
    }

    [Fact]
    public void Plans_a_fold_screen_in_folds_and_refuses_one_as_wide_as_the_plan()
    {
        var plan = CliHarness.Run("plan", "--screen-folds", "1", "--eta", "5", "--json");
        using var json = JsonDocument.Parse(plan.Output);
        Assert.Equal([1, 5], json.RootElement.GetProperty("fold_screen_rungs").EnumerateArray().Select(r => r.GetInt32()));

        var wide = CliHarness.Run("plan", "--screen-folds", "5");
        Assert.Equal(ExitCodes.Usage, wide.ExitCode);
        Assert.Contains("--screen-folds must be at least 1 and below the plan's 5 folds", wide.Output);
    }
}
