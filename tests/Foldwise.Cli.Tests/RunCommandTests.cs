using System.Globalization;
using System.Text.Json;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests;

[Trait(Lane.Key, Lane.Slow)]
public sealed class RunCommandTests : IDisposable
{
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public void Runs_a_table_with_a_text_column_and_gaps_and_says_what_it_did_with_each()
    {
        // Given a training table with a text column (some cells blank) and a numeric column with NA cells,
        // and a test table with a level training never saw
        var random = new Random(3);
        var train = new System.Text.StringBuilder("id,region,f1,y\n");
        string[] regions = ["north", "south", "east", "west"];
        for (int r = 0; r < 80; r++)
        {
            int level = random.Next(4);
            string region = r % 10 == 0 ? "" : regions[level];
            string f1 = r % 8 == 0 ? "NA" : random.Next(0, 5).ToString(CultureInfo.InvariantCulture);
            train.Append(CultureInfo.InvariantCulture, $"t{r},{region},{f1},{Math.Exp(1 + level):F3}\n");
        }

        workspace.Write("train.csv", train.ToString());
        workspace.Write("test.csv", "id,f1,region\nb0,1,north\nb1,NA,islands\nb2,2,\n");
        string definition = workspace.WriteDefinition(trials: 4);

        // When the search runs
        var run = CliHarness.Run("run", definition, "--out", workspace.Out);

        // Then the summary names the category column's levels and encoding, the test table's new level, and the gaps
        Assert.True(run.ExitCode == 0, run.Output);
        Assert.Contains("category region: 4 levels, each seen often enough to keep", run.Output, StringComparison.Ordinal);
        Assert.Contains("lightgbm: one column of level codes, grouped by LightGBM's own category splits; fasttree: one indicator column per kept level", run.Output, StringComparison.Ordinal);
        Assert.Contains("10.0% missing", run.Output, StringComparison.Ordinal);
        Assert.Contains("the test table has 1 new level in 1 row", run.Output, StringComparison.Ordinal);
        Assert.Contains("f1: 12.5% missing", run.Output, StringComparison.Ordinal);
        Assert.Equal(4, File.ReadAllLines(Path.Combine(workspace.Out, "predictions.csv")).Length);
    }

    [Fact]
    public void A_twelve_row_table_narrows_the_leaf_sizes_to_its_folds_and_every_trial_is_done()
    {
        // Given a 12-row training table and the default ranges (min_leaf_rows 5–100, 5 folds)
        workspace.WriteTables(trainRows: 12, testRows: 4);

        // When a search runs from flags alone
        var run = CliHarness.Run(
            "run", "--train", workspace.PathOf("train.csv"), "--test", workspace.PathOf("test.csv"), "--id", "id", "--target", "y",
            "--trials", "4", "--out", workspace.Out);

        // Then it says the range was narrowed, and no trial fails: the four screened on the first fold, then each family's
        // best screen on every fold (a search never ends with nothing to blend)
        Assert.True(run.ExitCode == 0, run.Output);
        Assert.Contains("lightgbm min_leaf_rows 5–100 narrowed to 2–2: the smallest fold trains on 9 rows", run.Output);
        var trials = Resume.StoredTrial.Read(workspace.Out);
        Assert.Equal(6, trials.Count);
        Assert.All(trials, t => Assert.Equal("done", t.State));
    }

    [Fact]
    public void Runs_a_search_to_a_prediction_file_and_history_shows_both_families()
    {
        // Given small tables and a definition with both families
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 10);

        // When the search runs
        var run = CliHarness.Run("run", definition, "--out", workspace.Out);

        // Then it screens, reports progress, blends and writes one finite, non-negative prediction per test id, in test order
        Assert.True(run.ExitCode == 0, run.Output);
        Assert.Contains("Screening kept 3 of 5 columns: dropped 1 constant, 1 duplicate", run.Output);
        Assert.Contains("Search stopped (trial budget reached): 10 done", run.Output);
        Assert.Contains("nested estimate", run.Output);
        var lines = File.ReadAllLines(Path.Combine(workspace.Out, "predictions.csv"));
        Assert.Equal("id,predicted_y", lines[0]);
        Assert.Equal(Enumerable.Range(0, 20).Select(r => $"b{r}"), lines.Skip(1).Select(l => l.Split(',')[0]));
        Assert.All(lines.Skip(1), l =>
        {
            double p = double.Parse(l.Split(',')[1], CultureInfo.InvariantCulture);
            Assert.True(double.IsFinite(p) && p >= 0, l);
        });

        // And history lists the trials of both families with their OOF scores, as a table and as JSON
        var history = CliHarness.Run("history", Path.Combine(workspace.Out, "search.db"));
        Assert.Equal(0, history.ExitCode);
        Assert.Contains("lightgbm", history.Output);
        Assert.Contains("fasttree", history.Output);
        Assert.Contains("OOF RMSLE", history.Output);
        Assert.Contains("10 trial(s): 10 done", history.Output);
        var wide = CliHarness.Run("history", workspace.Out, "--wide");
        Assert.Contains("a trial below its family's full budget (lightgbm", wide.Output);
        Assert.Contains("to 15 rounds) ran learning_rate × (full budget / budget)^0.5, at most 1 (schedule.rate_scaling)", wide.Output);

        var json = CliHarness.Run("history", workspace.Out, "--json");
        using var document = JsonDocument.Parse(json.Output);
        var trials = document.RootElement.EnumerateArray().ToList();
        Assert.Equal(10, trials.Count);
        Assert.Equal(10, trials.Select(t => t.GetProperty("id").GetInt32()).Distinct().Count());
        Assert.All(trials, t => Assert.Equal("done", t.GetProperty("state").GetString()));
        Assert.All(trials, t => Assert.True(t.GetProperty("score").GetDouble() > 0));
        Assert.Equal(["fasttree", "lightgbm"], trials.Select(t => t.GetProperty("family").GetString()).Distinct().Order());
    }

    [Fact]
    public void A_promotion_on_the_worker_that_screened_it_continues_the_screen_and_says_so()
    {
        // Given a LightGBM search racing over folds in one local worker process (its slots share the screens)
        workspace.WriteTables(trainRows: 120, testRows: 10);
        string definition = workspace.Write("racing.json", """
            {
              "data": { "train": "train.csv", "test": "test.csv", "id": "id", "target": "y" },
              "folds": 3,
              "screening": { "min_nonzero": 2 },
              "families": { "lightgbm": { "min_leaf_rows": 3 } },
              "schedule": { "kind": "asha", "proposer": "random", "full_budget": 30, "eta": 3, "screen_folds": 1 },
              "budget": { "trials": 12 }
            }
            """);

        // When it runs
        var run = CliHarness.Run("run", definition, "--out", workspace.Out);
        Assert.True(run.ExitCode == 0, run.Output);

        // Then every promotion to all folds took over its screen's rounds, as history's JSON, the run lines and show say
        var json = CliHarness.Run("history", workspace.Out, "--json");
        using var document = JsonDocument.Parse(json.Output);
        var promoted = document.RootElement.EnumerateArray().Where(t => t.GetProperty("parent").ValueKind == JsonValueKind.Number).ToList();
        Assert.NotEmpty(promoted);
        Assert.All(promoted, t => Assert.Equal(3, t.GetProperty("folds").GetInt32()));
        Assert.All(promoted, t => Assert.InRange(t.GetProperty("rounds_continued").GetInt32(), 1, 30));
        Assert.All(
            document.RootElement.EnumerateArray().Where(t => t.GetProperty("parent").ValueKind == JsonValueKind.Null),
            t => Assert.Equal(0, t.GetProperty("rounds_continued").GetInt32()));
        var first = promoted[0];
        int continued = first.GetProperty("rounds_continued").GetInt32();
        Assert.Contains($"({continued} continued)", run.Output);
        var show = CliHarness.Run("show", workspace.Out, first.GetProperty("id").GetInt32().ToString(CultureInfo.InvariantCulture));
        Assert.Contains($"{continued} rounds of its screen's fold models (trial {first.GetProperty("parent").GetInt32()}), not trained again", show.Output);
    }

    [Fact]
    public void Refuses_to_start_over_a_stored_search()
    {
        workspace.WriteTables();
        string definition = workspace.WriteDefinition(trials: 2);
        Directory.CreateDirectory(workspace.Out);
        File.WriteAllText(Path.Combine(workspace.Out, "search.db"), "");

        var run = CliHarness.Run("run", definition, "--out", workspace.Out);

        Assert.Equal(1, run.ExitCode);
        Assert.Contains("a search is already stored here; continue it with 'foldwise resume'", run.Output);
    }

    [Fact]
    public void Flags_stand_in_for_a_definition_file()
    {
        workspace.WriteTables();

        var run = CliHarness.Run(
            "run", "--train", workspace.PathOf("train.csv"), "--test", workspace.PathOf("test.csv"), "--id", "id", "--target", "y",
            "--trials", "2", "--out", workspace.Out);

        Assert.True(run.ExitCode == 0, run.Output);
        Assert.True(File.Exists(Path.Combine(workspace.Out, "predictions.csv")));
    }
}
