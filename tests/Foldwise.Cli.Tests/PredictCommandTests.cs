using System.Globalization;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests;

[Trait(Lane.Key, Lane.Slow)]
public sealed class PredictCommandTests(FinishedSearch search) : IClassFixture<FinishedSearch>
{
    [Fact]
    public void Scores_new_rows_with_the_kept_blend_under_the_search_s_prediction_header()
    {
        // Given a finished search and its own test table as new rows
        string scored = search.Workspace.PathOf("scored.csv");

        // When they are scored
        var predict = CliHarness.Run("predict", search.Store, "--rows", search.Workspace.PathOf("test.csv"), "--out", scored);

        // Then it says what it wrote, and the file is the search's prediction file to a relative 1e-6
        Assert.True(predict.ExitCode == 0, predict.Output);
        Assert.Contains("15 predictions from trial", predict.Output, StringComparison.Ordinal);
        var own = File.ReadAllLines(Path.Combine(search.Workspace.Out, "predictions.csv"));
        var again = File.ReadAllLines(scored);
        Assert.Equal("id,predicted_y", again[0]);
        Assert.Equal(own.Length, again.Length);
        foreach (var (a, b) in own.Skip(1).Zip(again.Skip(1)))
        {
            Assert.Equal(a.Split(',')[0], b.Split(',')[0]);
            double x = double.Parse(a.Split(',')[1], CultureInfo.InvariantCulture), y = double.Parse(b.Split(',')[1], CultureInfo.InvariantCulture);
            Assert.True(Math.Abs(x - y) <= 1e-6 * Math.Abs(x), $"{a} vs {b}");
        }
    }

    [Fact]
    public void Refuses_rows_without_a_training_feature_in_one_line_and_writes_nothing()
    {
        // Given new rows without the feature f2
        string rows = search.Workspace.Write("no-f2.csv", "id,f1,f3,f5\nc1,1,0,1\n");
        string scored = search.Workspace.PathOf("refused.csv");

        // When they are scored, then one line names the column and the file, the exit code is 1, and nothing is written
        var predict = CliHarness.Run("predict", search.Store, "--rows", rows, "--out", scored);
        Assert.Equal(ExitCodes.BadInput, predict.ExitCode);
        Assert.Single(predict.Output.Trim().Split('\n'));
        Assert.Contains("no-f2.csv", predict.Output, StringComparison.Ordinal);
        Assert.Contains("'f2'", predict.Output, StringComparison.Ordinal);
        Assert.False(File.Exists(scored));
    }

    [Fact]
    public void Show_names_a_kept_member_s_model_file_and_its_hash()
    {
        // Given a member of the kept blend
        var kept = Report.StoredSearch.Load(search.Store).Kept!;
        var member = kept.Members[0];

        // When it is shown, then the line names its file, whose name is its SHA-256
        var show = CliHarness.Run("show", search.Store, member.TrialId.ToString(CultureInfo.InvariantCulture));
        Assert.True(show.ExitCode == 0, show.Output);
        Assert.Contains($"models/{member.Hash}.fwm", show.Output, StringComparison.Ordinal);
        Assert.True(File.Exists(Path.Combine(search.Workspace.Out, "models", member.Hash + ".fwm")));
    }
}
