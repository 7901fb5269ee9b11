namespace Foldwise.Storage.Tests;

/// <summary>A store written by an earlier build (format 1, each per-row vector in one document) still opens and reads.</summary>
public sealed class FormatOneFixtureTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public FormatOneFixtureTests() =>
        File.Copy(Path.Combine(AppContext.BaseDirectory, "Fixtures", "format1-search.db"), _dir.StorePath);

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void A_format_one_store_reads_its_header_with_every_row()
    {
        using var store = SearchStore.OpenReadOnly(_dir.StorePath);

        var header = store.LoadHeader();

        // Then the fixture's 60 training rows, 20 test rows and 3-fold plan come back (Fixtures/README.md)
        Assert.NotNull(header);
        Assert.Equal(60, header.TrainIds.Length);
        Assert.Equal("r0", header.TrainIds[0]);
        Assert.Equal("r59", header.TrainIds[^1]);
        Assert.Equal(20, header.TestIds.Length);
        Assert.Equal("t19", header.TestIds[^1]);
        Assert.Equal(60, header.TrainTarget.Length);
        Assert.Equal(3, header.Folds.FoldCount);
        Assert.Equal(60, header.Folds.FoldOfRow.Length);
        Assert.All(header.Folds.FoldOfRow, f => Assert.InRange(f, 0, 2));
        Assert.True(header.Finished);
    }

    [Fact]
    public void A_format_one_store_reads_its_trials_vectors_and_blend()
    {
        using var store = SearchStore.OpenReadOnly(_dir.StorePath);

        var trials = store.LoadTrials();
        var vectors = store.LoadVectors(1);
        var blend = store.LoadBlend();

        // Then the two trials keep the scores the earlier build printed (0.17696 and 0.43797)
        Assert.Equal([1, 2], trials.Select(t => t.Id));
        Assert.Equal(0.17695753695480773, trials[0].Score);
        Assert.Equal(0.43797219657695646, trials[1].Score);
        Assert.NotNull(vectors);
        Assert.Equal(60, vectors.Value.OutOfFold.Length);
        Assert.Equal(20, vectors.Value.Test.Length);
        Assert.All(vectors.Value.OutOfFold, v => Assert.True(double.IsFinite(v) && v > 0));
        Assert.NotNull(blend);
        Assert.Equal(1.0, blend.Members.Single(m => m.TrialId == 1).Weight, 1e-9);
        Assert.NotNull(store.LoadScreening());
    }
}
