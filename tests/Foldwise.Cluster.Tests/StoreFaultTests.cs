using Foldwise.Cluster.Contracts;
using Foldwise.Cluster.Coordination;
using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;

namespace Foldwise.Cluster.Tests;

/// <summary>A store that refuses a write (a full disk) stops the search; what was committed stays and a resumed search goes on.</summary>
public sealed class StoreFaultTests
{
    private static readonly SearchDefinition Definition = new()
    {
        Name = "full-disk",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Budget = new SearchBudget(5, null),
    };

    [Fact]
    public void A_full_disk_while_committing_stops_the_search_and_resume_keeps_every_committed_trial()
    {
        // Given a store with room for two trials' predictions
        var recorder = new MemoryRecorder { FullAfter = 2 };
        var session = Session(recorder, []);
        for (int i = 0; i < 2; i++)
        {
            Assert.True(session.Report(Result(session.Lease("w", "0"))));
        }

        // When the third result cannot be written
        bool accepted = session.Report(Result(session.Lease("w", "0")));

        // Then the result is refused, the search stops with the reason, and slots are told it is over
        Assert.False(accepted);
        Assert.Equal("IOException: No space left on device", session.StoreFault);
        Assert.True(session.Finished.IsCompleted);
        Assert.Equal(LeaseStatus.Finished, session.Lease("w", "0").Status);

        // When space is freed and the search resumes from what the store holds
        recorder.FullAfter = null;
        var resumed = Session(recorder, recorder.Latest());

        // Then both committed trials are kept and the interrupted one runs again
        Assert.Equal(2, resumed.Coordinator.Progress().Done);
        var again = resumed.Lease("w", "0");
        Assert.Equal(3, again.TrialId);
        Assert.True(resumed.Report(Result(again)));
        Assert.Null(resumed.StoreFault);
    }

    private static CoordinatorSession Session(MemoryRecorder recorder, IEnumerable<TrialRecord> history) => new(
        new SearchManifest("full-disk", "train", "test", 3, 1, [0, 1, 2], "Rmsle", []),
        new SearchCoordinator(Definition, new CountingSchedule(), recorder, TimeProvider.System, history: history),
        recorder);

    private static TrialReport Result(LeaseReply lease)
    {
        Assert.Equal(LeaseStatus.Granted, lease.Status);
        return new TrialReport(lease.TrialId, lease.Attempt, "w", "0", 0.5, [0.5, 0.5, 0.5], [1, 2, 3], [4], 1.0);
    }
}
