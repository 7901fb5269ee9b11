using Foldwise.Storage.Writer;
using Foldwise.Testing;

namespace Foldwise.Storage.Tests;

/// <summary>
/// The coordinator's situation for real: another process writes the store while this one reads it,
/// and a writer killed mid-loop loses nothing it had acknowledged.
/// </summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class ProcessTests : IDisposable
{
    private static readonly TimeSpan Patience = TimeSpan.FromSeconds(60);
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void Reads_the_store_while_another_process_writes_it_and_finds_every_trial_afterwards()
    {
        // Given an empty store and a child process that saves 150 trials with vectors
        SearchStore.Create(_dir.StorePath).Dispose();
        using var child = WriterProcess.Loop(_dir.StorePath, "150", outOfFoldLength: 5_000, testLength: 20_000);

        // When this process reads it meanwhile
        var counts = new List<int>();
        using (var reader = SearchStore.OpenReadOnly(_dir.StorePath))
        {
            while (!child.HasExited)
            {
                var ids = reader.LoadTrials().Select(t => t.Id).ToList();
                Assert.Equal(Enumerable.Range(1, ids.Count), ids);
                if (ids.Count >= 2)
                {
                    // a trial's vectors are saved right after it, so the one before the last has them
                    var vectors = reader.LoadVectors(ids.Count - 1);
                    Assert.NotNull(vectors);
                    Same.Bits(SampleTrials.Vector(5_000, ids.Count - 1), vectors.Value.OutOfFold);
                }

                counts.Add(ids.Count);
            }
        }

        // Then the child finished cleanly, the reads saw the store grow, and every trial is there
        Assert.True(child.WaitForExit(Patience) == 0, child.Errors);
        Assert.Equal(150, child.Acknowledged);
        Assert.Equal(counts.Order(), counts);
        Assert.Contains(counts, n => n is > 0 and < 150);
        using var store = SearchStore.Open(_dir.StorePath);
        var trials = store.LoadTrials();
        Assert.Equal(150, trials.Count);
        foreach (var trial in trials)
        {
            Same.Trial(SampleTrials.Done(trial.Id), trial);
        }

        Same.Bits(SampleTrials.Vector(20_000, -150), store.LoadVectors(150)!.Value.Test);
    }

    [Fact]
    public void A_writer_killed_while_saving_loses_no_acknowledged_trial_and_the_search_resumes()
    {
        SearchStore.Create(_dir.StorePath).Dispose();
        var acknowledged = new List<int>();

        // Three rounds: a child resumes after the highest stored id, saves, and is killed mid-loop
        for (int round = 1; round <= 3; round++)
        {
            using (var child = WriterProcess.Loop(_dir.StorePath, "forever", outOfFoldLength: 50_000, testLength: 50_000))
            {
                int target = acknowledged.DefaultIfEmpty(0).Max() + 15;
                Assert.True(child.WaitForAcknowledged(target, Patience), $"The child stopped early: {child.Errors}");
                child.Kill();
                acknowledged.AddRange(child.AcknowledgedIds);
            }

            // Then a reader, and after it a writer, open the file and find every acknowledged trial and its vectors
            using (var reader = SearchStore.OpenReadOnly(_dir.StorePath))
            {
                AssertHolds(reader, acknowledged, round);
            }

            using var writer = SearchStore.Open(_dir.StorePath);
            AssertHolds(writer, acknowledged, round);
        }
    }

    private static void AssertHolds(SearchStore store, List<int> acknowledged, int round)
    {
        var trials = store.LoadTrials().ToDictionary(t => t.Id);

        // The child may have saved a trial it did not print (killed between Save and SaveVectors, or before
        // the print); the next round resumes after it, so such an id is a gap in the acknowledged list.
        foreach (int id in acknowledged)
        {
            Assert.True(trials.TryGetValue(id, out var trial), $"Round {round}: acknowledged trial {id} is missing.");
            Same.Trial(SampleTrials.Done(id), trial);
            var vectors = store.LoadVectors(id);
            Assert.True(vectors is not null, $"Round {round}: the vectors of acknowledged trial {id} are missing.");
        }

        int last = acknowledged[^1];
        var lastVectors = store.LoadVectors(last)!.Value;
        Same.Bits(SampleTrials.Vector(50_000, last), lastVectors.OutOfFold);
        Same.Bits(SampleTrials.Vector(50_000, -last), lastVectors.Test);
        Assert.InRange(trials.Count, acknowledged.Count, acknowledged.Count + round);
    }
}
