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

    internal static bool SameCells(SparseColumn a, SparseColumn b) =>
        a.Rows.AsSpan().SequenceEqual(b.Rows.AsSpan()) && a.Values.AsSpan().SequenceEqual(b.Values.AsSpan());
}
