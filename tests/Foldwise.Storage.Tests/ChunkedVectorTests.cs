using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Storage.Writer;
using LiteDB;

namespace Foldwise.Storage.Tests;

public sealed class ChunkedVectorTests : IDisposable
{
    // LiteDB 5's document cap is 16,683,050 bytes (its own error message: "Document size exceed 16683050 limit").
    private const int LiteDbDocumentCap = 16_683_050;

    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    private static SearchHeader TallHeader(int rows) => new()
    {
        SearchId = "tall",
        Definition = new SearchDefinition
        {
            Name = "tall",
            Data = new DataSource("/runs/tall/train.csv", "/runs/tall/test.csv", "id", "y"),
            Families = [new FamilySearch("lightgbm", DefaultSpaces.For("lightgbm"))],
            Budget = new SearchBudget(Trials: 10, Hours: null),
        },
        Folds = new FoldPlan(5, 3, [.. Enumerable.Range(0, rows).Select(r => r % 5)]),
        TrainHash = "a",
        TestHash = "b",
        TrainIds = [.. Enumerable.Range(0, rows).Select(r => $"member-{r:D8}")],
        TestIds = [.. Enumerable.Range(0, rows / 5).Select(r => $"new-{r:D8}")],
        TrainTarget = [.. SampleTrials.Vector(rows, 4)],
        Created = SampleTrials.Epoch,
    };

    [Fact]
    public void A_header_of_a_million_rows_is_stored_and_read_back_whole()
    {
        // Given a million row ids, more than one LiteDB document holds as one array
        var header = TallHeader(1_000_000);
        using var store = SearchStore.Create(_dir.StorePath);

        // When the header is saved and read back
        store.SaveHeader(header);
        var loaded = store.LoadHeader();

        // Then every row id, target and fold comes back in order
        Assert.NotNull(loaded);
        Assert.Equal(header.TrainIds.ToArray(), loaded.TrainIds.ToArray());
        Assert.Equal(header.TestIds.ToArray(), loaded.TestIds.ToArray());
        Same.Bits([.. header.TrainTarget], [.. loaded.TrainTarget]);
        Assert.Equal(header.Folds.FoldOfRow.ToArray(), loaded.Folds.FoldOfRow.ToArray());
    }

    [Fact]
    public void Prediction_vectors_larger_than_a_document_round_trip_bit_for_bit()
    {
        // Given out-of-fold predictions of 2.5 million rows (20 MB, past the document cap)
        var outOfFold = SampleTrials.Vector(2_500_000, seed: 5);
        Assert.True(outOfFold.Length * sizeof(double) > LiteDbDocumentCap);
        var test = SampleTrials.Vector(300_000, seed: 6);
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveVectors(7, outOfFold, test);
        var loaded = store.LoadVectors(7);

        Assert.NotNull(loaded);
        Same.Bits(outOfFold, loaded.Value.OutOfFold);
        Same.Bits(test, loaded.Value.Test);
    }

    [Fact]
    public void No_stored_document_nears_the_cap_however_long_the_vectors()
    {
        using (var store = SearchStore.Create(_dir.StorePath))
        {
            store.SaveHeader(TallHeader(1_000_000));
            store.SaveVectors(1, SampleTrials.Vector(2_500_000, seed: 1), SampleTrials.Vector(10, seed: 2));
        }

        using var db = new LiteDatabase(new ConnectionString { Filename = _dir.StorePath, Connection = ConnectionType.Shared, ReadOnly = true });
        foreach (string name in db.GetCollectionNames())
        {
            foreach (var doc in db.GetCollection(name).FindAll())
            {
                Assert.True(BsonSerializer.Serialize(doc).Length <= Chunks.Bytes + 1024, $"a document of '{name}' holds {BsonSerializer.Serialize(doc).Length} bytes");
            }
        }
    }

    [Fact]
    public void Saving_shorter_vectors_again_removes_the_old_tail_chunks()
    {
        using var store = SearchStore.Create(_dir.StorePath);
        store.SaveVectors(2, SampleTrials.Vector(400_000, 1), []);

        var shorter = SampleTrials.Vector(10, 2);
        store.SaveVectors(2, shorter, []);

        Same.Bits(shorter, store.LoadVectors(2)!.Value.OutOfFold);
        store.Dispose();

        using var db = new LiteDatabase(new ConnectionString { Filename = _dir.StorePath, Connection = ConnectionType.Shared, ReadOnly = true });
        var left = db.GetCollection(Chunks.Collection).FindAll().Select(d => d["_id"].AsString).ToArray();
        Assert.Equal(["trial.2.outOfFold#0"], left.Where(id => id.StartsWith("trial.2.outOfFold#", StringComparison.Ordinal)));
    }

    [Fact]
    public void Texts_of_any_kind_round_trip_as_row_ids()
    {
        var header = TallHeader(5) with { TrainIds = ["", "é ✓", "a,b\n\"c\"", new string('x', 3_000_000), "🚚"] };
        using var store = SearchStore.Create(_dir.StorePath);

        store.SaveHeader(header);

        Assert.Equal(header.TrainIds.ToArray(), store.LoadHeader()!.TrainIds.ToArray());
    }

    [Fact]
    public void A_missing_chunk_is_reported_as_a_damaged_store()
    {
        using (var store = SearchStore.Create(_dir.StorePath))
        {
            store.SaveVectors(3, SampleTrials.Vector(300_000, 1), []);
        }

        using (var db = new LiteDatabase(new ConnectionString { Filename = _dir.StorePath, Connection = ConnectionType.Shared }))
        {
            db.GetCollection(Chunks.Collection).Delete("trial.3.outOfFold#1");
        }

        using var reader = SearchStore.OpenReadOnly(_dir.StorePath);
        var error = Assert.Throws<StoreException>(() => reader.LoadVectors(3));
        Assert.Equal("The search store is damaged: vectors of trial 3: chunk 'trial.3.outOfFold#1' is missing.", error.Message);
    }
}
