using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Demo;

namespace Foldwise.Core.Tests.Demo;

public sealed class DemoCsvWriterTests : IDisposable
{
    private readonly string directory = Directory.CreateTempSubdirectory("foldwise-demo-csv-").FullName;

    public void Dispose() => Directory.Delete(directory, recursive: true);

    [Fact]
    public void Writes_a_header_then_every_cell_with_zeros_spelled_out()
    {
        // Given a 3 × 4 table with a few non-zero cells, one of them fractional, and one awkward id
        var table = Table(["S1", "S,2", "S3"], [2.5, 0, 1e6]);
        string path = Path.Combine(directory, "t.csv");

        // When it is written with its target
        DemoCsvWriter.Write(table, path, "shipper_id", "q1_spend");

        // Then each line holds the id, four features and the target, in invariant culture
        Assert.Equal(
            "shipper_id,a,b,c,d,q1_spend\nS1,0,3,0,0,2.5\n\"S,2\",1.25,0,0,7,0\nS3,0,0,0,0,1000000\n",
            File.ReadAllText(path));
    }

    [Fact]
    public void Leaves_the_target_out_when_asked_and_refuses_one_the_table_lacks()
    {
        var withTarget = Table(["S1", "S2", "S3"], [1, 2, 3]);
        var withoutTarget = Table(["S1", "S2", "S3"], null);
        string path = Path.Combine(directory, "test.csv");

        DemoCsvWriter.Write(withTarget, path, "shipper_id", targetColumn: null);

        Assert.StartsWith("shipper_id,a,b,c,d\nS1,0,3,0,0\n", File.ReadAllText(path));
        Assert.Throws<ArgumentException>(() => DemoCsvWriter.Write(withoutTarget, Path.Combine(directory, "other.csv"), "shipper_id", "q1_spend"));
        Assert.Equal(["test.csv"], Directory.GetFiles(directory).Select(Path.GetFileName));
    }

    [Fact]
    public void Replaces_an_existing_file_whole_and_leaves_no_temporary_file()
    {
        // Given a file already at the destination
        string path = Path.Combine(directory, "train.csv");
        File.WriteAllText(path, "old contents that are much longer than the new ones will be, so a partial overwrite would show");

        // When the table is written over it
        DemoCsvWriter.Write(Table(["S1", "S2", "S3"], [1, 2, 3]), path, "id", "y");

        // Then only the new file is there
        Assert.StartsWith("id,a,b,c,d,y\n", File.ReadAllText(path));
        Assert.EndsWith("S3,0,0,0,0,3\n", File.ReadAllText(path));
        Assert.Single(Directory.GetFileSystemEntries(directory));
    }

    [Fact]
    public void Writes_the_quick_demo_with_one_line_per_row_and_one_field_per_column()
    {
        var (train, _) = FreightDemo.Generate(DemoSize.Quick, seed: 3);
        string path = Path.Combine(directory, "quick.csv");

        DemoCsvWriter.Write(train, path, FreightDemo.IdColumn, FreightDemo.TargetColumn);

        // Then each line holds the id, every lane, the three text facts (blank where missing) and the target
        var lines = File.ReadAllLines(path);
        Assert.Equal(train.RowCount + 1, lines.Length);
        Assert.All(lines, l => Assert.Equal(train.FeatureCount + 3 + 2, l.Split(',').Length));
        Assert.EndsWith(",region,sector,signing_channel,q1_spend", lines[0]);
        long nonZero = lines.Skip(1).Sum(l => l.Split(',')[1..(1 + train.FeatureCount)].Count(f => f != "0"));
        Assert.Equal(train.Columns.Sum(c => (long)c.NonZeroCount), nonZero);
        int blanks = lines.Skip(1).Sum(l => l.Split(',')[(1 + train.FeatureCount)..^1].Count(f => f.Length == 0));
        Assert.Equal(train.Categories.Sum(c => c.MissingCount), blanks);
    }

    /// <summary>Columns a, b, c, d: b[0] = 3, a[1] = 1.25, d[1] = 7.</summary>
    private static FeatureTable Table(string[] ids, double[]? target) => new(
        "t",
        [.. ids],
        ["a", "b", "c", "d"],
        [new SparseColumn([1], [1.25f]), new SparseColumn([0], [3f]), SparseColumn.Empty, new SparseColumn([1], [7f])],
        target is null ? [] : [.. target]);
}
