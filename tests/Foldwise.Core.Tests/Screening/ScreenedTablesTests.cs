using Foldwise.Core.Screening;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Screening;

public sealed class ScreenedTablesTests
{
    [Fact]
    public void Aligns_the_test_table_then_cuts_both_to_the_kept_columns()
    {
        // Given a training table with a constant and a repeated column, and a test table in another order with an extra column
        var train = TinyTables.FromColumns(
            [("a", [1, 0, 2]), ("k", [5, 5, 5]), ("b", [0, 3, 4]), ("a2", [1, 0, 2])], [1, 2, 3], "train.csv");
        var test = TinyTables.FromColumns(
            [("b", [1, 1]), ("extra", [2, 2]), ("a2", [0, 0]), ("k", [0, 1]), ("a", [3, 0])], source: "test.csv");

        // When prepared
        var screened = ScreenedTables.Prepare(train, test, new ScreeningOptions(MinNonZero: 2));

        // Then both tables hold the kept columns in training order, and the extra column is reported
        Assert.Equal(["a", "b"], screened.Train.FeatureNames.ToArray());
        Assert.Equal(["a", "b"], screened.Test.FeatureNames.ToArray());
        Assert.Equal([3f], screened.Test.Columns[0].Values.ToArray());
        Assert.Equal(["extra"], screened.ExtraTestColumns.ToArray());
        Assert.Equal(2, screened.Report.Dropped.Length);
        Assert.Equal("test.csv", screened.Test.Source);
    }
}
