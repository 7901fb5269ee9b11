using Foldwise.Cluster.Workers;

namespace Foldwise.Cluster.Tests;

public sealed class WorkerOptionsTests
{
    [Theory]
    [InlineData(1)]
    [InlineData(2)]
    [InlineData(8)]
    public void A_slot_fits_with_one_thread_unless_told_otherwise_whatever_the_slot_count(int slots)
    {
        // Given a worker with some slots and no thread count
        var options = new WorkerOptions { Slots = slots };

        // Then each fit uses one thread
        Assert.Equal(1, options.Threads);
    }

    [Fact]
    public void A_thread_count_given_wins()
    {
        // Given a worker told to fit with 2 threads per slot
        var options = new WorkerOptions { Slots = 1, ThreadsPerSlot = 2 };

        // Then each fit uses 2
        Assert.Equal(2, options.Threads);
    }
}
