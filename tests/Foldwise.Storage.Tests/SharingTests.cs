using Foldwise.Storage.Writer;
using Foldwise.Testing;

namespace Foldwise.Storage.Tests;

/// <summary>A writer and readers on one file within one process; <see cref="ProcessTests"/> does it across processes.</summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class SharingTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void A_reader_opened_first_sees_trials_the_writer_saves_afterwards()
    {
        // Given a writer and a reader open on the same file
        using var writer = SearchStore.Create(_dir.StorePath);
        using var reader = SearchStore.OpenReadOnly(_dir.StorePath);
        Assert.Empty(reader.LoadTrials());

        // When the writer saves, then the reader sees each save at once
        writer.Save(SampleTrials.Done(1));
        Same.Trial(SampleTrials.Done(1), Assert.Single(reader.LoadTrials()));
        writer.Save(SampleTrials.Queued(2));
        writer.SaveVectors(2, [1.5], [2.5]);
        Assert.Equal(2, reader.LoadTrials().Count);
        Assert.Equal([1.5], reader.LoadVectors(2)!.Value.OutOfFold);
    }

    [Fact]
    public async Task A_reader_polling_in_a_loop_does_not_stop_the_writer()
    {
        // Given a reader thread that loads every trial as fast as it can
        using var writer = SearchStore.Create(_dir.StorePath);
        using var reader = SearchStore.OpenReadOnly(_dir.StorePath);
        using var stop = new CancellationTokenSource();
        var seen = new System.Collections.Concurrent.ConcurrentQueue<int>();
        var firstRead = new TaskCompletionSource(TaskCreationOptions.RunContinuationsAsynchronously);
        var polling = Task.Run(() =>
        {
            while (!stop.IsCancellationRequested)
            {
                var ids = reader.LoadTrials().Select(t => t.Id).ToList();
                Assert.Equal(Enumerable.Range(1, ids.Count), ids); // saved in order, so always a prefix
                seen.Enqueue(ids.Count);
                firstRead.TrySetResult();
            }
        });

        // When the writer saves 300 trials (more than a page of LoadTrials) meanwhile, once the reader is polling
        // (pausing now and then, so a loaded machine still interleaves the two)
        await firstRead.Task.WaitAsync(TimeSpan.FromSeconds(30));
        var writing = Task.Run(() =>
        {
            for (int id = 1; id <= 300; id++)
            {
                writer.Save(SampleTrials.Done(id));
                if (id % 25 == 0)
                {
                    Thread.Sleep(20);
                }
            }
        });

        // Then it finishes, every trial is there, and the reader saw the count grow
        await writing.WaitAsync(TimeSpan.FromSeconds(30)); // throws TimeoutException if the reader held it up
        await stop.CancelAsync();
        await polling.WaitAsync(TimeSpan.FromSeconds(30));
        Assert.Equal(300, reader.LoadTrials().Count);
        Assert.Equal(seen.Order(), seen.ToArray());
        Assert.Contains(seen, n => n is > 0 and < 300);
    }

    [Fact]
    public void One_instance_serves_several_threads_at_once()
    {
        // Given one writer shared by four threads (an Orleans grain may call it from any thread)
        using var writer = SearchStore.Create(_dir.StorePath);

        // When each saves fifty trials and their vectors
        Parallel.For(0, 4, new ParallelOptions { MaxDegreeOfParallelism = 4 }, thread =>
        {
            for (int i = 1; i <= 50; i++)
            {
                int id = (thread * 50) + i;
                writer.Save(SampleTrials.Done(id));
                writer.SaveVectors(id, [id], []);
                Assert.NotNull(writer.LoadTrial(id));
            }
        });

        // Then all two hundred are stored
        Assert.Equal(Enumerable.Range(1, 200), writer.LoadTrials().Select(t => t.Id));
        Assert.Equal([200.0], writer.LoadVectors(200)!.Value.OutOfFold);
    }
}
