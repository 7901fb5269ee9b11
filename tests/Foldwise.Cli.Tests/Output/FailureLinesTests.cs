using Foldwise.Cli.Output;
using Foldwise.Core.Events;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests.Output;

/// <summary>The coordinator's screen says why attempts fail and which machine it quarantined; a worker's screen says why it leaves.</summary>
public sealed class FailureLinesTests
{
    [Fact]
    public void The_coordinator_names_the_machine_and_reason_of_a_failed_attempt_and_a_quarantine()
    {
        var console = new TestConsole().Width(220);
        var view = new ProgressView(console);

        view.Report(new AttemptFailed("s", 7, 2, "office-pc-3/1", "DllNotFoundException: lib_lightgbm.so"));
        view.Report(new WorkerQuarantined("s", "office-pc-3", "3 trials failed in a row; last: DllNotFoundException: lib_lightgbm.so"));

        Assert.Contains("Attempt 2 of trial 7 failed on office-pc-3/1: DllNotFoundException: lib_lightgbm.so; queued again", console.Output, StringComparison.Ordinal);
        Assert.Contains("Worker office-pc-3 quarantined: 3 trials failed in a row; last: DllNotFoundException: lib_lightgbm.so", console.Output, StringComparison.Ordinal);
    }

    [Fact]
    public void A_worker_says_which_family_it_cannot_offer_and_why_it_leaves()
    {
        using var output = new StringWriter();
        var lines = new WorkerLines(output);

        lines.Report(new FamilyNotOffered("lightgbm", "libgomp.so.1 is missing (OpenMP's runtime)"));
        lines.Report(new WorkerRefused("192.0.2.10:11111", "no family trains on this machine"));
        lines.Report(new WorkerSearchFinished("s-1", Leaving: false));

        Assert.Equal(
            [
                "lightgbm cannot train on this machine and is not offered: libgomp.so.1 is missing (OpenMP's runtime)",
                "Cannot work for 192.0.2.10:11111: no family trains on this machine",
                "Search s-1 finished; waiting for the next search (Ctrl-C to leave)",
            ],
            output.ToString().Split(Environment.NewLine, StringSplitOptions.RemoveEmptyEntries));
    }
}
