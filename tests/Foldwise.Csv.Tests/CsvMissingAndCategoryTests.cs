using Foldwise.Core.Data;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv.Tests;

/// <summary>Missing cells become NaN in numeric columns; text columns become category columns of level codes.</summary>
public sealed class CsvMissingAndCategoryTests
{
    [Fact]
    public void Reads_empty_cells_and_missing_words_as_NaN_in_a_numeric_column_ignoring_case()
    {
        // Given a numeric column with an empty cell, "na", "NaN" and "NULL"
        using var csv = new TempCsv("id,y,a\nr1,1,2\nr2,1,\nr3,1,na\nr4,1,NaN\nr5,1,NULL\nr6,1,0\n");

        // When it is read
        var table = Train(csv);

        // Then the column stays numeric, with NaN stored for each missing cell and nothing for the zero
        Assert.Equal(["a"], table.FeatureNames.ToArray());
        Assert.Empty(table.CategoryNames);
        Assert.Equal([0, 1, 2, 3, 4], table.Columns[0].Rows.ToArray());
        Assert.Equal(2f, table.Columns[0].Values[0]);
        Assert.Equal(4, table.Columns[0].MissingCount);
    }

    [Fact]
    public void Turns_a_column_with_a_text_cell_into_a_category_column_keeping_earlier_numbers_as_levels()
    {
        // Given a column that holds numbers, then text, then a gap
        using var csv = new TempCsv("id,y,a,b\nr1,1,1,2\nr2,1,0,3\nr3,1,red,4\nr4,1,,5\nr5,1,red,6\n");

        var table = Train(csv);

        // Then 'a' is a category column whose levels are "1", "0", "red" and whose gap is missing
        Assert.Equal(["b"], table.FeatureNames.ToArray());
        Assert.Equal(["a"], table.CategoryNames.ToArray());
        Assert.Equal(["1", "0", "red"], table.Categories[0].Levels.ToArray());
        Assert.Equal([0, 1, 2, CategoryColumn.Missing, 2], table.Categories[0].Codes.ToArray());
    }

    [Fact]
    public void Reads_declared_columns_as_categories_keeping_their_text_and_skips_ignored_columns()
    {
        // Given numeric-coded postcodes with leading zeros and a free-text note to ignore
        using var csv = new TempCsv("id,y,postcode,note,a\nr1,1,0042,hello,1\nr2,1,042,there,2\n");
        var rules = TableRules.Default with { Categories = ["postcode"], Ignored = ["note"] };

        var table = CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle, rules);

        Assert.Equal(["a"], table.FeatureNames.ToArray());
        Assert.Equal(["postcode"], table.CategoryNames.ToArray());
        Assert.Equal(["0042", "042"], table.Categories[0].Levels.ToArray());
    }

    [Fact]
    public void Reads_a_training_category_column_as_a_category_in_the_test_table_even_when_its_cells_look_numeric()
    {
        using var train = new TempCsv("id,y,size\nr1,1,S\nr2,1,10\n");
        using var test = new TempCsv("id,size\nt1,10\nt2,XL\nt3,\n", "test.csv");

        var table = CsvTableReader.ReadTest(test.Path, "id", "y", TableRules.Default, Train(train));

        Assert.Equal(["size"], table.CategoryNames.ToArray());
        Assert.Equal(["10", "XL"], table.Categories[0].Levels.ToArray());
        Assert.Equal([0, 1, CategoryColumn.Missing], table.Categories[0].Codes.ToArray());
    }

    [Fact]
    public void Round_trips_category_columns_through_the_table_encoding()
    {
        using var csv = new TempCsv("id,y,a,c\nr1,1,1,red\nr2,2,,blue\nr3,3,3,\n");
        var table = Train(csv);

        var decoded = TableCodec.Decode(TableCodec.Encode(table), "bytes");

        Assert.Equal(table.CategoryNames.ToArray(), decoded.CategoryNames.ToArray());
        Assert.Equal(table.Categories[0].Levels.ToArray(), decoded.Categories[0].Levels.ToArray());
        Assert.Equal(table.Categories[0].Codes.ToArray(), decoded.Categories[0].Codes.ToArray());
        Assert.Equal(1, decoded.Columns[0].MissingCount);
    }

    private static FeatureTable Train(TempCsv csv) => CsvTableReader.ReadTraining(csv.Path, "id", "y", Metric.Rmsle);
}
