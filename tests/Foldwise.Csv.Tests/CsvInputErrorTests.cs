using Foldwise.Core.Data;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv.Tests;

/// <summary>Each bad input gives one InputException naming the file, the line (header = 1) and the column.</summary>
public sealed class CsvInputErrorTests
{
    [Fact]
    public void Reports_a_missing_file()
    {
        // Given a path where no file exists
        using var csv = new TempCsv("id\n");

        // When it is read
        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTest(csv.Missing, "id", null));

        // Then the message names the file and nothing more precise
        AssertAt(e, csv.Missing, null, null, "does not exist");
    }

    [Fact]
    public void Reports_an_empty_file()
    {
        using var csv = new TempCsv(string.Empty);

        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTest(csv.Path, "id", null));

        AssertAt(e, csv.Path, null, null, "the file is empty");
    }

    [Fact]
    public void Reports_a_file_with_a_header_but_no_rows()
    {
        using var csv = new TempCsv("id,y,a\n\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, null, null, "header but no data rows");
    }

    [Fact]
    public void Names_the_missing_id_column()
    {
        using var csv = new TempCsv("key,y,a\nr1,1,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 1, null, "no id column 'id'");
    }

    [Fact]
    public void Names_the_missing_target_column()
    {
        using var csv = new TempCsv("id,price,a\nr1,1,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 1, null, "no target column 'y'");
    }

    [Fact]
    public void Reports_a_row_with_fewer_fields_than_the_header()
    {
        // Given a third line that lacks its last field
        using var csv = new TempCsv("id,y,a,b\nr1,1,2,3\nr2,1,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        // Then the column is the first missing one
        AssertAt(e, csv.Path, 3, 4, "the row has 3 fields but the header has 4");
    }

    [Fact]
    public void Reports_a_row_with_more_fields_than_the_header()
    {
        using var csv = new TempCsv("id,y,a\nr1,1,2,3,4\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        // Then the column is the first extra one
        AssertAt(e, csv.Path, 2, 4, "the row has 5 fields but the header has 3");
    }

    [Fact]
    public void Names_both_files_when_a_numeric_training_column_holds_text_in_the_test_table()
    {
        // Given a column of numbers in training and a text cell in the same column of the test table
        using var train = new TempCsv("id,y,a,b\nr1,1,2,3\nr2,1,2,4\n");
        using var test = new TempCsv("id,b,a\nt1,3,2\nt2,x,2\n", "test.csv");
        var table = Train(train);

        // When the test table is read for it
        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTest(test.Path, "id", "y", TableRules.Default, table));

        // Then one line names both files, the test line and the column
        AssertAt(e, test.Path, 3, 2, $"column 'b' holds only numbers in {train.Path} but the text \"x\" here");
    }

    [Fact]
    public void Names_both_files_when_a_text_training_column_holds_only_numbers_in_the_test_table()
    {
        using var train = new TempCsv("id,y,a,b\nr1,1,2,red\nr2,1,2,blue\n");
        using var test = new TempCsv("id,b,a\nt1,3,2\nt2,4,2\n", "test.csv");
        var table = Train(train);

        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTest(test.Path, "id", "y", TableRules.Default, table));

        AssertAt(e, test.Path, 1, 2, $"column 'b' holds text in {train.Path} but only numbers here");
    }

    [Fact]
    public void Refuses_a_default_missing_word_beside_empty_cells_in_a_category_column()
    {
        // Given a text column where "NA" may be a level (North America) and blanks are the gaps
        using var csv = new TempCsv("id,y,region\nr1,1,NA\nr2,1,EU\nr3,1,\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 4, 3, "category column 'region' has blank cells (line 4) and \"NA\", a default missing word that may be a level here; set 'data.missing'");
    }

    [Fact]
    public void Takes_both_as_missing_when_the_definition_lists_its_missing_words()
    {
        using var csv = new TempCsv("id,y,region\nr1,1,NA\nr2,1,EU\nr3,1,\n");
        var rules = TableRules.Default with { MissingWords = ["NA"], MissingWordsStated = true };

        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle, rules);

        Assert.Equal([-1, 0, -1], table.Categories[0].Codes.ToArray());
    }

    [Theory]
    [InlineData("")]
    [InlineData("NA")]
    [InlineData("null")]
    public void Reports_a_missing_target(string cell)
    {
        using var csv = new TempCsv($"id,y,a\nr1,1,2\nr2,{cell},2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 3, 2, "the target 'y' is missing; every training row needs one");
    }

    [Fact]
    public void Names_a_declared_category_column_the_header_lacks()
    {
        using var csv = new TempCsv("id,y,a\nr1,1,2\n");
        var rules = TableRules.Default with { Categories = ["postcode"] };

        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle, rules));

        AssertAt(e, csv.Path, 1, null, "'data.categories' names 'postcode', which the header lacks");
    }

    [Theory]
    [InlineData("Infinity")]
    [InlineData("-Infinity")]
    [InlineData("1e39")]
    public void Reports_a_feature_that_is_not_a_finite_number(string cell)
    {
        using var csv = new TempCsv($"id,y,a\nr1,1,2\nr2,1,{cell}\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 3, 3, $"column 'a' holds \"{cell}\", which is not a finite 32-bit number");
    }

    [Theory]
    [InlineData("Infinity")]
    [InlineData("-Infinity")]
    public void Reports_a_target_that_is_not_a_finite_number(string cell)
    {
        using var csv = new TempCsv($"id,a,y\nr1,2,1\nr2,2,{cell}\n");

        var e = Assert.Throws<InputException>(() => CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmse));

        AssertAt(e, csv.Path, 3, 3, "column 'y': target is");
        Assert.Contains("not a finite number", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Reports_a_negative_target_under_rmsle()
    {
        using var csv = new TempCsv("id,y,a\nr1,1,2\nr2,-0.5,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 3, 2, "column 'y': target -0.5 is negative, which RMSLE cannot score");
    }

    [Fact]
    public void Accepts_a_negative_target_under_rmse()
    {
        using var csv = new TempCsv("id,y,a\nr1,1,2\nr2,-0.5,2\n");

        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmse);

        Assert.Equal([1, -0.5], table.Target.ToArray());
    }

    [Fact]
    public void Names_both_lines_of_a_duplicate_id()
    {
        using var csv = new TempCsv("y,id,a\n1,r1,2\n1,r2,2\n1,r1,3\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 4, 2, "id \"r1\" repeats the id on line 2");
    }

    [Fact]
    public void Names_a_duplicate_header_name_and_both_of_its_columns()
    {
        using var csv = new TempCsv("id,y,a,b,a\nr1,1,2,3,4\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 1, 5, "column name 'a' appears twice in the header, as columns 3 and 5");
    }

    [Fact]
    public void Reports_a_header_column_without_a_name()
    {
        using var csv = new TempCsv("id,y,a,\nr1,1,2,3\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 1, 4, "header column 4 has no name");
    }

    [Theory]
    [InlineData("")]
    [InlineData("N/A")]
    public void Reports_a_missing_id(string cell)
    {
        using var csv = new TempCsv($"id,y,a\nr1,1,2\n{cell},1,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 3, 1, "the id is missing");
    }

    [Fact]
    public void Reports_a_broken_quote()
    {
        using var csv = new TempCsv("id,y,a\nr1,1,2\n\"r2\"x,1,2\n");

        var e = Assert.Throws<InputException>(() => Train(csv));

        AssertAt(e, csv.Path, 3, 1, "the row is not valid CSV");
    }

    private static FeatureTable Train(TempCsv csv) => CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle);

    private static void AssertAt(InputException e, string file, long? line, int? column, string problem)
    {
        Assert.Equal(file, e.File);
        Assert.Equal(line, e.Line);
        Assert.Equal(column, e.Column);
        string where = (line, column) switch
        {
            ({ } l, { } c) => $"{file}:{l}:{c}: ",
            ({ } l, null) => $"{file}:{l}: ",
            _ => $"{file}: ",
        };
        Assert.StartsWith(where, e.Message, StringComparison.Ordinal);
        Assert.Contains(problem, e.Message, StringComparison.Ordinal);
    }
}
