using System.Text.Json;

namespace Foldwise.Cli.Tests.Inspection;

public sealed class ShowAndStatusTests : IDisposable
{
    private readonly InspectedStore store = new();

    public void Dispose() => store.Dispose();

    [Fact]
    public void Show_tells_a_promoted_trial_with_its_lineage_fold_spread_and_lost_attempt()
    {
        // Given a store whose trial 3 continues trial 1 and lost one lease
        // When a lead shows trial 3
        var show = CliHarness.Run("show", store.Path, "3");

        // Then they read its rung, lineage, fold scores with their spread, machine, duration and attempts
        Assert.True(show.ExitCode == 0, show.Output);
        Assert.Contains("Trial 3: lightgbm, done", show.Output);
        Assert.Contains("1, 15 rounds", show.Output);
        Assert.DoesNotContain("bracket", show.Output, StringComparison.Ordinal); // a schedule without brackets names none
        Assert.Contains("promotion of trial 1", show.Output);
        Assert.Contains("3 (15 rounds, 0.40000) ← 1 (5 rounds, 0.50000)", show.Output);
        Assert.Contains("0.30000  0.40000  0.50000", show.Output);
        Assert.Contains("sd 0.10000, range 0.30000 to 0.50000", show.Output);
        Assert.Contains("w2/0", show.Output);
        Assert.Contains("90.0 s", show.Output);
        Assert.Contains("2 (1 lost)", show.Output);
        Assert.Contains("1: lease expired on w2/0", show.Output);

        // And the parameters readably, with the range each was searched over
        Assert.Matches(@"leaves\s+31\s+8 to 128", show.Output);
        Assert.Matches(@"learning_rate\s+0\.05\s+0\.01 to 0\.3 \(log\)", show.Output);
    }

    [Fact]
    public void Show_names_the_failure_of_a_failed_trial_and_who_it_was_promoted_to()
    {
        var failed = CliHarness.Run("show", store.Folder, "4");
        var parent = CliHarness.Run("show", store.Path, "1");

        Assert.True(failed.ExitCode == 0, failed.Output);
        Assert.Contains("Trial 4: fasttree, failed", failed.Output);
        Assert.Contains("not scored", failed.Output);
        Assert.Contains("InvalidOperationException: fold 2 returned no predictions", failed.Output);
        Assert.Contains("3 (3 lost)", failed.Output);
        Assert.Matches(@"promoted to\s+3 \(15 rounds\)", parent.Output);
    }

    [Fact]
    public void Show_as_json_carries_readable_parameters_and_the_parent_chain()
    {
        var show = CliHarness.Run("show", store.Path, "3", "--json");

        Assert.True(show.ExitCode == 0, show.Output);
        using var json = JsonDocument.Parse(show.Output);
        var root = json.RootElement;
        Assert.Equal(3, root.GetProperty("id").GetInt32());
        Assert.Equal([1], root.GetProperty("parent_chain").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal(0.1, root.GetProperty("fold_sd").GetDouble(), 12);
        Assert.Equal("31", root.GetProperty("parameters_readable").GetProperty("leaves").GetString());
        Assert.Equal(31, root.GetProperty("parameters").GetProperty("leaves").GetDouble());
        Assert.Equal("1: lease expired on w2/0", root.GetProperty("lost_attempts")[0].GetString());
    }

    [Fact]
    public void Show_of_an_unknown_trial_is_a_one_line_input_error()
    {
        var show = CliHarness.Run("show", store.Path, "99");

        Assert.Equal(1, show.ExitCode);
        Assert.Contains("has no trial 99", show.Output);
    }

    [Fact]
    public void Status_of_a_running_search_gives_states_queue_time_best_per_family_and_busy_slots()
    {
        var status = CliHarness.Run("status", store.Path);

        Assert.True(status.ExitCode == 0, status.Output);
        Assert.Contains("is not finished", status.Output);
        Assert.Contains("Trials: 6 created: 3 done, 1 running, 1 queued, 1 failed (budget 10 trials).", status.Output);
        Assert.Contains("Queue length: 1.", status.Output);
        Assert.Contains("Time spent: 00:30:00 of 01:00:00 (50 %).", status.Output);
        Assert.Matches(@"lightgbm\s+0\.40000\s+3\s+15\s+2", status.Output);
        Assert.Matches(@"fasttree\s+0\.60000\s+2\s+5\s+1", status.Output);
        Assert.Contains("Running now: 1 trial(s) on 1 machine(s).", status.Output);
        Assert.Matches(@"w2/1\s+5\s+lightgbm\s+5\s+2025-03-04 09:05:00Z", status.Output);
    }

    [Fact]
    public void Status_says_finished_once_the_header_says_so()
    {
        using var done = new InspectedStore(finished: true);

        var status = CliHarness.Run("status", done.Folder);

        Assert.True(status.ExitCode == 0, status.Output);
        Assert.Contains("Search inspect-test finished and its blend is stored.", status.Output);
    }

    [Fact]
    public void History_lists_every_state_best_first_with_noise_and_lineage()
    {
        var history = CliHarness.Run("history", store.Path);

        Assert.True(history.ExitCode == 0, history.Output);
        var rows = history.Output.Split('\n').Where(l => System.Text.RegularExpressions.Regex.IsMatch(l, @"^\s+\d+\s+(lightgbm|fasttree)")).ToList();
        Assert.Equal(["3", "1", "2", "5", "6", "4"], rows.Select(r => r.Trim().Split(' ')[0]));
        Assert.Matches(@"3\s+lightgbm\s+done\s+1\s+15\s+0\.40000\s+0\.1000\s+promotion of 1\s+w2/0\s+90\.0", history.Output);
        Assert.Contains("6 trial(s): 3 done, 1 running, 1 queued, 1 failed.", history.Output);
    }
}
