using Foldwise.Storage.Writer;
using LiteDB;

namespace Foldwise.Storage.Tests;

public sealed class OpeningTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void Creating_a_store_where_one_exists_fails_and_leaves_it_intact()
    {
        using (var first = SearchStore.Create(_dir.StorePath))
        {
            first.Save(SampleTrials.Done(1));
        }

        var error = Assert.Throws<StoreException>(() => SearchStore.Create(_dir.StorePath));

        Assert.Contains("already exists", error.Message);
        Assert.Contains(_dir.StorePath, error.Message);
        using var store = SearchStore.OpenReadOnly(_dir.StorePath);
        Assert.Single(store.LoadTrials());
    }

    [Fact]
    public void Creates_the_output_directory_when_it_is_missing()
    {
        string path = StoreFile.PathIn(Path.Combine(_dir.Path, "out", "run1"));

        using var store = SearchStore.Create(path);

        Assert.True(File.Exists(path));
        Assert.Equal(path, store.FilePath);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Opening_a_missing_file_names_the_path(bool readOnly)
    {
        var error = Assert.Throws<StoreException>(() => OpenStore(_dir.StorePath, readOnly));

        Assert.Equal($"There is no search store at {_dir.StorePath}.", error.Message);
        Assert.False(File.Exists(_dir.StorePath));
    }

    [Theory]
    [InlineData("id,target\n1,2.5\n", false)]
    [InlineData("id,target\n1,2.5\n", true)]
    [InlineData("", false)]
    [InlineData("", true)]
    public void Refuses_a_file_that_is_not_a_database_without_changing_it(string text, bool readOnly)
    {
        // Given a CSV (long enough to pass as a page) or an empty file named search.db
        string content = text.Length == 0 ? "" : string.Concat(Enumerable.Repeat(text, 1_000));
        File.WriteAllText(_dir.StorePath, content);

        var error = Assert.Throws<StoreException>(() => OpenStore(_dir.StorePath, readOnly));

        Assert.StartsWith($"{_dir.StorePath} is not a Foldwise search store:", error.Message);
        Assert.Equal(content, File.ReadAllText(_dir.StorePath));
    }

    [Fact]
    public void Refuses_a_database_that_foldwise_did_not_write()
    {
        using (var other = new LiteDatabase(new ConnectionString { Filename = _dir.StorePath, Connection = ConnectionType.Shared }))
        {
            other.GetCollection("customers").Insert(new BsonDocument { ["name"] = "x" });
        }

        var error = Assert.Throws<StoreException>(() => SearchStore.Open(_dir.StorePath));

        Assert.Equal($"{_dir.StorePath} is not a Foldwise search store: it is a LiteDB database without Foldwise's format record.", error.Message);
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Refuses_a_store_written_by_a_newer_format(bool readOnly)
    {
        // Given a store whose format record says a version this build does not know
        SearchStore.Create(_dir.StorePath).Dispose();
        using (var db = new LiteDatabase(new ConnectionString { Filename = _dir.StorePath, Connection = ConnectionType.Shared }))
        {
            var meta = db.GetCollection(StoreFormat.MetaCollection);
            var format = meta.FindById("format");
            format["version"] = StoreFormat.Version + 1;
            format["writer"] = "Foldwise 9.0.0";
            meta.Update(format);
        }

        var error = Assert.Throws<StoreException>(() => OpenStore(_dir.StorePath, readOnly));

        Assert.StartsWith(
            $"search.db was written by a newer Foldwise (store format {StoreFormat.Version + 1}); this one reads up to {StoreFormat.Version}.",
            error.Message);
        Assert.Contains("Foldwise 9.0.0", error.Message);
    }

    [Fact]
    public void Refuses_a_second_writer_while_the_first_is_open_and_admits_one_after_it_closed()
    {
        var first = SearchStore.Create(_dir.StorePath);

        var error = Assert.Throws<StoreBusyException>(() => SearchStore.Open(_dir.StorePath));
        Assert.Contains("Another process is writing", error.Message);
        using (var reader = SearchStore.OpenReadOnly(_dir.StorePath))
        {
            Assert.True(reader.IsReadOnly);
        }

        first.Dispose();
        using var second = SearchStore.Open(_dir.StorePath);
        Assert.False(second.IsReadOnly);
    }

    [Fact]
    public void A_read_only_store_refuses_every_write()
    {
        SearchStore.Create(_dir.StorePath).Dispose();
        using var reader = SearchStore.OpenReadOnly(_dir.StorePath);

        Assert.Throws<StoreException>(() => reader.Save(SampleTrials.Done(1)));
        Assert.Throws<StoreException>(() => reader.SaveVectors(1, [1.0], [2.0]));
        var error = Assert.Throws<StoreException>(() => reader.UpdateSpent(1, finished: false));

        Assert.Contains("read-only", error.Message);
        Assert.Null(reader.LoadTrial(1));
    }

    [Fact]
    public void Reports_the_tool_that_wrote_the_store()
    {
        SearchStore.Create(_dir.StorePath).Dispose();

        using var store = SearchStore.OpenReadOnly(_dir.StorePath);

        Assert.Equal(StoreFormat.ToolVersion, store.WrittenBy);
        Assert.StartsWith("Foldwise ", store.WrittenBy);
    }

    [Fact]
    public void A_disposed_store_refuses_calls()
    {
        var store = SearchStore.Create(_dir.StorePath);
        store.Dispose();

        Assert.Throws<ObjectDisposedException>(() => store.LoadTrials());
        store.Dispose(); // a second dispose is harmless
    }

    [Fact]
    public void Names_the_conventional_path_in_an_output_directory()
    {
        Assert.Equal(Path.Combine("out", "search.db"), StoreFile.PathIn("out"));
        Assert.False(StoreFile.ExistsIn(_dir.Path));
        SearchStore.Create(_dir.StorePath).Dispose();
        Assert.True(StoreFile.ExistsIn(_dir.Path));
    }

    private static SearchStore OpenStore(string path, bool readOnly) =>
        readOnly ? SearchStore.OpenReadOnly(path) : SearchStore.Open(path);
}
