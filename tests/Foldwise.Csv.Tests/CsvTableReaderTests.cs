using System.Text;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv.Tests;

public sealed class CsvTableReaderTests
{
    [Fact]
    public void Reads_ids_the_target_and_only_the_non_zero_cells_of_a_training_table()
    {
        // Given a training file whose target sits between two features
        using var csv = new TempCsv("id,a,y,b\nr1,0,10,2.5\nr2,1.5,0,0\nr3,0,3.25,-4\n");

        // When it is read
        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle);

        // Then ids, target and features come back, with zeros not stored
        Assert.Equal(csv.Path, table.Source);
        Assert.Equal(["r1", "r2", "r3"], table.Ids.ToArray());
        Assert.Equal([10, 0, 3.25], table.Target.ToArray());
        Assert.Equal(["a", "b"], table.FeatureNames.ToArray());
        Assert.Equal([1], table.Columns[0].Rows.ToArray());
        Assert.Equal([1.5f], table.Columns[0].Values.ToArray());
        Assert.Equal([0, 2], table.Columns[1].Rows.ToArray());
        Assert.Equal([2.5f, -4f], table.Columns[1].Values.ToArray());
    }

    [Fact]
    public void Reads_a_test_table_and_skips_its_target_column()
    {
        // Given a test file that carries a target column with a value no metric accepts
        using var csv = new TempCsv("id,a,y\nt1,1,NaN\nt2,0,oops\n");

        // When it is read as a test table naming that column
        var table = CsvTableReader.ReadTest(csv.Path, "id", "y");

        // Then the column is neither a feature nor a target
        Assert.False(table.HasTarget);
        Assert.Equal(["a"], table.FeatureNames.ToArray());
        Assert.Equal(2, table.RowCount);
    }

    [Fact]
    public void Reads_a_test_table_that_has_no_target_column()
    {
        // Given a test file without the named target column
        using var csv = new TempCsv("id,a,b\nt1,1,0\n");

        // When it is read
        var table = CsvTableReader.ReadTest(csv.Path, "id", "y");

        // Then every other column is a feature
        Assert.Equal(["a", "b"], table.FeatureNames.ToArray());
        Assert.False(table.HasTarget);
    }

    [Fact]
    public void Parses_numbers_in_invariant_form_and_treats_every_spelling_of_zero_as_zero()
    {
        // Given cells with exponents, signs and zeros written several ways
        using var csv = new TempCsv("id,a\nr1,1e-3\nr2,-2.5E2\nr3,0.0\nr4,-0\nr5,+7\n");

        // When it is read
        var table = CsvTableReader.ReadTest(csv.Path, "id", null);

        // Then the values are exact and no zero is stored
        Assert.Equal([0, 1, 4], table.Columns[0].Rows.ToArray());
        Assert.Equal([0.001f, -250f, 7f], table.Columns[0].Values.ToArray());
    }

    [Fact]
    public void Accepts_crlf_line_ends_a_byte_order_mark_quoted_ids_and_blank_lines()
    {
        // Given a file written the way spreadsheet tools often write one
        using var csv = new TempCsv("\uFEFFid,a\r\n\"x,1\",2\r\n\r\n\"y\",3\r\n\r\n");

        // When it is read
        var table = CsvTableReader.ReadTest(csv.Path, "id", null);

        // Then the BOM is not part of the first name and blank lines are not rows
        Assert.Equal(["x,1", "y"], table.Ids.ToArray());
        Assert.Equal([2f, 3f], table.Columns[0].Values.ToArray());
    }

    [Fact]
    public void Keeps_a_column_of_zeros_as_an_empty_column()
    {
        // Given a feature that is zero in every row
        using var csv = new TempCsv("id,y,z\nr1,1,0\nr2,2,0\n");

        // When it is read
        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmse);

        // Then the feature is present with no cells
        Assert.Equal(["z"], table.FeatureNames.ToArray());
        Assert.Equal(0, table.Columns[0].NonZeroCount);
    }

    [Fact]
    public void Reads_a_wide_row_longer_than_the_default_buffer()
    {
        // Given 20,000 features in one row (~160 K characters, past Sylvan's 16 K default buffer)
        var header = new StringBuilder("id");
        var row = new StringBuilder("r1");
        for (int i = 0; i < 20_000; i++)
        {
            header.Append(",f").Append(i);
            row.Append(i % 2 == 0 ? ",0" : ",0.123456");
        }

        using var csv = new TempCsv($"{header}\n{row}\n");

        // When it is read
        var table = CsvTableReader.ReadTest(csv.Path, "id", null);

        // Then every feature is there and half hold a cell
        Assert.Equal(20_000, table.FeatureCount);
        Assert.Equal(10_000, table.Columns.Sum(c => c.NonZeroCount));
    }

    [Fact]
    public void Refuses_one_column_as_both_id_and_target()
    {
        using var csv = new TempCsv("id,a\nr1,1\n");

        Assert.Throws<ArgumentException>(() => CsvTableReader.ReadTraining(csv.Path, "id", "id", Metric.Rmse));
    }
}
