using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;

namespace Foldwise.Cluster.Tests;

/// <summary>The coordinator says each failed attempt with its machine and reason, and the worker it quarantines.</summary>
public sealed class FailureEventsTests
{
    private static readonly SearchDefinition Definition = new()
    {
        Name = "failures",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Budget = new SearchBudget(10, null),
    };

    [Fact]
    public void A_machine_whose_trials_keep_failing_is_named_with_each_reason_and_then_quarantined()
    {
        // Given a search where one machine finished a trial
        var events = new SyncEvents();
        var recorder = new MemoryRecorder();
        var session = new CoordinatorSession(
            new SearchManifest("failures", "train", "test", 3, 1, [0, 1, 2], "Rmsle", []),
            new SearchCoordinator(Definition, new CountingSchedule(), recorder, TimeProvider.System),
            recorder,
            events);
        var good = session.Lease("good", "0");
        Assert.True(session.Report(new TrialReport(good.TrialId, good.Attempt, "good", "0", 0.5, [0.5, 0.5, 0.5], [1, 2, 3], [4], 1.0)));

        // When another machine gives back three leases in a row, each with the reason its slot failed
        for (int i = 0; i < 3; i++)
        {
            var lease = session.Lease("bad", "0");
            Assert.Equal(LeaseStatus.Granted, lease.Status);
            Assert.True(session.Release(lease.TrialId, lease.Attempt, "DllNotFoundException: lib_lightgbm.so", interrupted: false));
        }

        // Then each failure that queued its trial again names the machine and the reason
        var attempts = events.OfType<AttemptFailed>();
        Assert.Equal(3, attempts.Count + events.OfType<TrialFailed>().Count);
        Assert.All(attempts, a => Assert.Equal(("bad/0", "DllNotFoundException: lib_lightgbm.so"), (a.Machine, a.Reason)));

        // And the machine is reported quarantined once, with why, and gets no further lease
        var quarantined = Assert.Single(events.OfType<WorkerQuarantined>());
        Assert.Equal("bad", quarantined.Worker);
        Assert.Contains("3 trials failed in a row; last: DllNotFoundException: lib_lightgbm.so", quarantined.Reason, StringComparison.Ordinal);
        Assert.Equal(LeaseStatus.Quarantined, session.Lease("bad", "0").Status);
    }
}
