using Foldwise.Core.Data;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv.Tests;

/// <summary>
/// A row without quotes is split by the loader itself, skipping runs of zero cells (ZeroRun); a row with a quote is read
/// field by field. Both must give the same table.
/// </summary>
public sealed class UnquotedRowTests
{
    // Zeros written many ways, gaps, whole numbers the short path reads and ones it leaves to the general parser, a column
    // that turns to text on its last row, a declared category with zero-like codes, an ignored column, a text category,
    // a trailing zero cell, a blank line and a CRLF line end.
    private const string Header = "id,a,b,c,skip,code,late,kind,y,z\n";

    private static readonly string[] Rows =
    [
        "r1,0,0,0,0,007,0,red,10,0",
        "r2,00,0.0,-0,5,0,0,blue,11,0",
        "r3,,NA,1234567,0,00,0,,12,3",
        "r4,12345678,0.5,05,0,7,0,red,13,0",
        "",
        "r5,1e3,0,0,0,0,0,blue,14,0\r",
        "r6,0,0,0,0,,text,red,15,0",
    ];

    private static readonly TableRules Rules = TableRules.Default with { Categories = ["code"], Ignored = ["skip"] };

    [Fact]
    public void A_row_without_quotes_reads_as_the_same_row_with_a_quoted_id()
    {
        // Given the table as written and the same table with every id quoted (each row then read field by field)
        using var plain = new TempCsv(Header + string.Join('\n', Rows) + "\n");
        using var quoted = new TempCsv(Header + string.Join('\n', Rows.Select(r => r.Length == 0 ? r : "\"" + r[..2] + "\"" + r[2..])) + "\n");

        // When both are read as training tables
        var expected = CsvTableReader.ReadTraining(quoted.Path, "id", "y", Metric.Rmsle, Rules);
        var actual = CsvTableReader.ReadTraining(plain.Path, "id", "y", Metric.Rmsle, Rules);

        // Then every id, target, feature cell and category code is the same
        Assert.Equal(expected.Ids.ToArray(), actual.Ids.ToArray());
        Assert.Equal(expected.Target.ToArray(), actual.Target.ToArray());
        Assert.Equal(expected.FeatureNames.ToArray(), actual.FeatureNames.ToArray());
        for (int c = 0; c < expected.FeatureCount; c++)
        {
            Assert.Equal(expected.Columns[c].Rows.ToArray(), actual.Columns[c].Rows.ToArray());
            Assert.Equal(expected.Columns[c].Values.ToArray(), actual.Columns[c].Values.ToArray());
        }

        Assert.Equal(expected.CategoryNames.ToArray(), actual.CategoryNames.ToArray());
        for (int c = 0; c < expected.CategoryNames.Length; c++)
        {
            Assert.Equal(expected.Categories[c].Levels.ToArray(), actual.Categories[c].Levels.ToArray());
            Assert.Equal(expected.Categories[c].Codes.ToArray(), actual.Categories[c].Codes.ToArray());
        }

        // And the cells read as they are written (a sample, worked by hand)
        Assert.Equal(["a", "b", "c", "z"], actual.FeatureNames.ToArray());
        Assert.Equal(["code", "late", "kind"], actual.CategoryNames.ToArray());
        Assert.Equal([2, 3, 4], actual.Columns[0].Rows.ToArray());
        Assert.Equal([float.NaN, 12345678f, 1000f], actual.Columns[0].Values.ToArray());
        Assert.Equal([2, 3], actual.Columns[2].Rows.ToArray());
        Assert.Equal([1234567f, 5f], actual.Columns[2].Values.ToArray());
        Assert.Equal([2], actual.Columns[3].Rows.ToArray());
        Assert.Equal(["007", "0", "00", "7"], actual.Categories[0].Levels.ToArray());
        Assert.Equal(["0", "text"], actual.Categories[1].Levels.ToArray());
    }
}
