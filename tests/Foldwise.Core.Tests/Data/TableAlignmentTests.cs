using Foldwise.Core.Data;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Data;

public sealed class TableAlignmentTests
{
    private static readonly FeatureTable Train = TinyTables.FromColumns(
        [("a", [1, 0]), ("b", [0, 2]), ("c", [3, 3])], [1, 2], "train.csv");

    [Fact]
    public void Orders_test_columns_as_the_training_table_by_name()
    {
        // Given a test table with the same features in another order
        var test = TinyTables.FromColumns([("c", [7, 0, 0]), ("a", [0, 5, 0]), ("b", [0, 0, 6])], source: "test.csv");

        // When it is aligned
        var aligned = TableAlignment.AlignTest(Train, test);

        // Then its columns follow the training order and carry their own cells
        Assert.Equal(["a", "b", "c"], aligned.Table.FeatureNames.ToArray());
        Assert.Equal([5f], aligned.Table.Columns[0].Values.ToArray());
        Assert.Equal([6f], aligned.Table.Columns[1].Values.ToArray());
        Assert.Equal([7f], aligned.Table.Columns[2].Values.ToArray());
        Assert.Equal(test.Ids.ToArray(), aligned.Table.Ids.ToArray());
        Assert.Empty(aligned.ExtraColumns);
    }

    [Fact]
    public void Drops_extra_test_columns_and_names_them()
    {
        var test = TinyTables.FromColumns([("new2", [1]), ("a", [1]), ("b", [1]), ("new1", [1]), ("c", [1])], source: "test.csv");

        var aligned = TableAlignment.AlignTest(Train, test);

        Assert.Equal(["a", "b", "c"], aligned.Table.FeatureNames.ToArray());
        Assert.Equal(["new2", "new1"], aligned.ExtraColumns.ToArray());
    }

    [Fact]
    public void Names_the_test_file_and_a_training_column_it_lacks()
    {
        var test = TinyTables.FromColumns([("a", [1]), ("c", [1])], source: "/data/test.csv");

        var e = Assert.Throws<InputException>(() => TableAlignment.AlignTest(Train, test));

        Assert.Equal("/data/test.csv", e.File);
        Assert.Equal("/data/test.csv: the test table has no column 'b', which the training table has", e.Message);
    }
}
