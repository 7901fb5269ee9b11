using Foldwise.Core;
using Foldwise.Storage;

namespace Foldwise.Cli.Tests;

/// <summary>The command line is parsed strictly, and each outcome has its own exit code (the README's table).</summary>
public sealed class CommandLineTests : IDisposable
{
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public void A_mistyped_option_is_a_usage_error_that_names_it()
    {
        // Given a store path (the option is refused before anything is opened)
        string store = workspace.PathOf("search.db");

        // When history gets --jsn instead of --json, and run gets --trails instead of --trials
        var history = CliHarness.Run("history", store, "--jsn");
        var run = CliHarness.Run("run", "--trails", "1", "--out", workspace.Out);

        // Then both exit 2 and name the option as it was typed
        Assert.Equal(ExitCodes.Usage, history.ExitCode);
        Assert.Contains("unknown option '--jsn'", history.Output);
        Assert.Equal(ExitCodes.Usage, run.ExitCode);
        Assert.Contains("unknown option '--trails'", run.Output);
        Assert.False(Directory.Exists(workspace.Out));
    }

    [Fact]
    public void A_mistyped_command_is_a_usage_error_that_names_it()
    {
        var mistyped = CliHarness.Run("histroy", "search.db");

        Assert.Equal(ExitCodes.Usage, mistyped.ExitCode);
        Assert.Contains("'histroy'", mistyped.Output);
    }

    [Fact]
    public void An_invalid_flag_value_is_a_usage_error()
    {
        var plan = CliHarness.Run("plan", "--eta", "1");

        Assert.Equal(ExitCodes.Usage, plan.ExitCode);
        Assert.Contains("--eta must be at least 2", plan.Output);
    }

    [Fact]
    public void Version_prints_the_build_version_and_its_commit()
    {
        var version = CliHarness.Run("--version");

        Assert.Equal(ExitCodes.Ok, version.ExitCode);
        Assert.Equal(BuildVersion.Text, version.Output.Trim());
        Assert.Matches(@"^\d+\.\d+\.\d+(\+[0-9a-f]{12})?$", BuildVersion.Text);
    }

    [Fact]
    public void A_store_another_process_writes_is_refused_with_exit_4()
    {
        // Given a store whose writer lock is held (as by a running coordinator)
        Directory.CreateDirectory(workspace.Out);
        using var running = SearchStore.Create(Path.Combine(workspace.Out, "search.db"));

        // When resume tries to write it
        var resume = CliHarness.Run("resume", workspace.Out);

        // Then it is refused as busy, not as bad input
        Assert.Equal(ExitCodes.StoreBusy, resume.ExitCode);
        Assert.Contains("Another process is writing", resume.Output);
    }

    [Fact]
    public void A_coordinator_listening_beyond_loopback_without_a_certificate_is_refused_unless_an_open_cluster_is_accepted()
    {
        // When a search would listen on an office address without --cert
        var run = CliHarness.Run("run", "--train", "a.csv", "--test", "b.csv", "--id", "i", "--target", "y", "--out", workspace.Out,
            "--port", "23111", "--advertise", "192.0.2.10");

        // Then it does not start, and says the risk and both ways out in one line
        Assert.Equal(ExitCodes.Usage, run.ExitCode);
        Assert.Contains("anyone who can reach this machine's ports could read the training table and post results", run.Output);
        Assert.Contains("--cert FILE", run.Output);
        Assert.Contains("--open-cluster", run.Output);
        Assert.False(Directory.Exists(workspace.Out));
    }

    [Fact]
    public void Clear_cache_deletes_the_cached_tables_without_joining()
    {
        string cache = workspace.PathOf("tables");
        Directory.CreateDirectory(cache);
        File.WriteAllText(Path.Combine(cache, "0a.fwt"), "x");

        var clear = CliHarness.Run("worker", "--clear-cache", "--cache", cache);

        Assert.Equal(ExitCodes.Ok, clear.ExitCode);
        Assert.Contains("Deleted 1 cached table(s)", clear.Output);
        Assert.Empty(Directory.GetFiles(cache));
    }

    [Fact]
    public void Exit_codes_are_distinct_and_the_readme_lists_each()
    {
        int[] codes = [ExitCodes.Ok, ExitCodes.BadInput, ExitCodes.Usage, ExitCodes.Failed, ExitCodes.StoreBusy, ExitCodes.Refused, ExitCodes.Interrupted];
        string readme = File.ReadAllText(Path.Combine(RepositoryRoot(), "README.md"));

        Assert.Equal(codes.Length, codes.Distinct().Count());
        Assert.All(codes, code => Assert.Contains($"| {code} |", readme));
    }

    private static string RepositoryRoot()
    {
        var dir = new DirectoryInfo(AppContext.BaseDirectory);
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "Foldwise.slnx")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("no Foldwise.slnx above " + AppContext.BaseDirectory);
    }
}
