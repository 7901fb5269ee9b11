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
        Assert.All(trials, t => Assert.Null(t.BestRound));
        Assert.All(trials, t => Assert.Equal(0, t.RoundsContinued));
        Assert.All(trials, t => Assert.True(t.AllFolds));
        Assert.NotNull(vectors);
        Assert.Equal(60, vectors.Value.OutOfFold.Length);
        Assert.Equal(20, vectors.Value.Test.Length);
        Assert.All(vectors.Value.OutOfFold, v => Assert.True(double.IsFinite(v) && v > 0));
        Assert.NotNull(blend);
        Assert.Equal(1.0, blend.Members.Single(m => m.TrialId == 1).Weight, 1e-9);
        Assert.NotNull(store.LoadScreening());
    }

    [Fact]
    public void Opening_a_format_one_store_to_resume_raises_its_version_and_keeps_what_it_held()
    {
        // Given the format-1 fixture, opened to write as a resumed search does
        using (var store = SearchStore.Open(_dir.StorePath))
        {
            // When a new trial's vectors are saved in the chunked layout beside the old inline ones
            store.SaveVectors(3, SampleVector(300_000), [1.5]);
        }

        // Then the file says this build's format, and old and new records both read, its definition text too
        Assert.Equal(StoreFormat.Version, FormatVersion());
        using var reader = SearchStore.OpenReadOnly(_dir.StorePath);
        Assert.Equal(60, reader.LoadHeader()!.TrainIds.Length);
        Assert.Equal(60, reader.LoadVectors(1)!.Value.OutOfFold.Length);
        Assert.Equal(SampleVector(300_000), reader.LoadVectors(3)!.Value.OutOfFold);
    }

    [Fact]
    public void Reading_a_format_one_store_leaves_its_version_alone()
    {
        using (var store = SearchStore.OpenReadOnly(_dir.StorePath))
        {
            Assert.Equal(2, store.LoadTrials().Count);
        }

        Assert.Equal(1, FormatVersion());
    }

    private static double[] SampleVector(int length) => [.. Enumerable.Range(0, length).Select(i => i * 0.25)];

    private int FormatVersion()
    {
        using var db = new LiteDB.LiteDatabase(new LiteDB.ConnectionString { Filename = _dir.StorePath, Connection = LiteDB.ConnectionType.Shared, ReadOnly = true });
        return db.GetCollection(StoreFormat.MetaCollection).FindById("format")["version"].AsInt32;
    }
}
