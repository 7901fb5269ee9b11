using Foldwise.Core.Data;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Data;

public sealed class TableCodecTests
{
    private static FeatureTable Sample(string source = "train.csv", float corner = 2.5f) => TinyTables.FromColumns(
        [
            ("lane_ä", [0, 1.5f, 0, -3e-8f]),
            ("empty", [0, 0, 0, 0]),
            ("b", [corner, float.Epsilon, float.MaxValue, 0]),
        ],
        [1, 0, 123456.789, double.Epsilon],
        source);

    [Fact]
    public void Round_trips_ids_names_target_and_cells_exactly()
    {
        // Given a table with odd values and a non-ASCII name
        var table = Sample();

        // When it is encoded and decoded
        var back = TableCodec.Decode(TableCodec.Encode(table), "fetched");

        // Then everything but the source is equal, bit for bit
        Assert.Equal("fetched", back.Source);
        Assert.Equal(table.Ids.ToArray(), back.Ids.ToArray());
        Assert.Equal(table.FeatureNames.ToArray(), back.FeatureNames.ToArray());
        Assert.Equal(table.Target.ToArray(), back.Target.ToArray());
        Assert.Equal(table.Columns.ToArray(), back.Columns.ToArray(), SameCells);
        Assert.Equal(TableCodec.Encode(table), TableCodec.Encode(back));
    }

    [Fact]
    public void Round_trips_a_table_without_a_target()
    {
        var table = TinyTables.FromRows([[1, 0], [0, 2]]);

        var back = TableCodec.Decode(TableCodec.Encode(table), "test.csv");

        Assert.False(back.HasTarget);
        Assert.Equal(table.Columns.ToArray(), back.Columns.ToArray(), SameCells);
    }

    [Fact]
    public void Starts_with_the_magic_and_version()
    {
        var bytes = TableCodec.Encode(Sample());

        Assert.Equal("FWTB"u8.ToArray(), bytes[..4]);
        Assert.Equal(2, BitConverter.ToInt32(bytes, 4));
    }

    [Fact]
    public void Rejects_bytes_that_are_not_an_encoding()
    {
        Assert.Throws<InvalidDataException>(() => TableCodec.Decode("NOPE...."u8, "x"));
    }

    [Fact]
    public void Rejects_a_truncated_encoding()
    {
        var bytes = TableCodec.Encode(Sample());

        Assert.Throws<InvalidDataException>(() => TableCodec.Decode(bytes.AsSpan(0, bytes.Length - 3), "x"));
    }

    [Fact]
    public void Rejects_an_unknown_version()
    {
        var bytes = TableCodec.Encode(Sample());
        bytes[4] = 99;

        var e = Assert.Throws<InvalidDataException>(() => TableCodec.Decode(bytes, "x"));
        Assert.Contains("version 99", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Streams_the_same_bytes_as_the_array_form_and_returns_their_hash()
    {
        // Given a table whose encoding is several times the writer's 64 KiB buffer
        var random = new Random(2);
        var table = TinyTables.FromColumns(
            [.. Enumerable.Range(0, 3).Select(c => ($"x{c}", Enumerable.Range(0, 20_000).Select(_ => random.Next(3) == 0 ? random.NextSingle() : 0f).ToArray()))],
            [.. Enumerable.Range(0, 20_000).Select(r => r * 0.5)],
            "train.csv");
        using var stream = new MemoryStream();

        // When it is encoded to a stream and decoded from one
        string hash = TableCodec.Encode(table, stream);
        stream.Position = 0;
        var back = TableCodec.Decode(stream, "cache.fwt");

        // Then the bytes are the array form's, the hash is theirs, and the table comes back whole
        byte[] array = TableCodec.Encode(table);
        Assert.True(array.Length > 4 * (1 << 16));
        Assert.Equal(array, stream.ToArray());
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(array)), hash);
        Assert.Equal(TableHash.Of(table), hash);
        Assert.Equal(table.Columns.ToArray(), back.Columns.ToArray(), SameCells);
        Assert.Equal(table.Target.ToArray(), back.Target.ToArray());
    }

    internal static bool SameCells(SparseColumn a, SparseColumn b) =>
        a.Rows.AsSpan().SequenceEqual(b.Rows.AsSpan()) && a.Values.AsSpan().SequenceEqual(b.Values.AsSpan());
}
