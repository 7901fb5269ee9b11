using Foldwise.Core.Data;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Data;

public sealed class TableHashTests
{
    private static FeatureTable Table(string source = "a.csv", float cell = 4) => TinyTables.FromColumns(
        [("x", [1, 0, 3]), ("z", [0, cell, 0])],
        [1, 2, 3],
        source);

    [Fact]
    public void Is_lowercase_hex_sha256_of_the_encoding()
    {
        var table = Table();

        string hash = TableHash.Of(table);

        Assert.Matches("^[0-9a-f]{64}$", hash);
        Assert.Equal(Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(TableCodec.Encode(table))), hash);
    }

    [Fact]
    public void Is_stable_for_equal_content_from_different_sources()
    {
        // Given the same content loaded from two paths
        // Then the hashes agree
        Assert.Equal(TableHash.Of(Table("a.csv")), TableHash.Of(Table("/elsewhere/b.csv")));
    }

    [Fact]
    public void Changes_when_one_cell_changes()
    {
        Assert.NotEqual(TableHash.Of(Table(cell: 4)), TableHash.Of(Table(cell: 4.0001f)));
    }

    [Fact]
    public void Changes_when_a_cell_moves_to_another_column()
    {
        var left = TinyTables.FromColumns([("x", [1, 0]), ("z", [0, 0])]);
        var right = TinyTables.FromColumns([("x", [0, 0]), ("z", [1, 0])]);

        Assert.NotEqual(TableHash.Of(left), TableHash.Of(right));
    }
}
