using Foldwise.Core.Data;
using Foldwise.Core.Screening;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Screening;

public sealed class ColumnScreenTests
{
    private static readonly ScreeningOptions Options = new(MinNonZero: 2);

    [Fact]
    public void Drops_a_column_of_zeros_as_constant()
    {
        var train = TinyTables.FromColumns([("zeros", [0, 0, 0, 0]), ("ok", [1, 2, 0, 3])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal([new DroppedColumn("zeros", DropReason.Constant)], report.Dropped.ToArray());
        Assert.Equal(["ok"], report.Kept.ToArray());
    }

    [Fact]
    public void Drops_a_column_holding_one_non_zero_value_in_every_row_as_constant()
    {
        var train = TinyTables.FromColumns([("sevens", [7, 7, 7, 7]), ("ok", [1, 2, 0, 3])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal(DropReason.Constant, Assert.Single(report.Dropped).Reason);
    }

    [Fact]
    public void Keeps_a_column_that_mixes_one_value_with_zeros()
    {
        // A single non-zero value plus zeros is two values, so not constant
        var train = TinyTables.FromColumns([("flag", [1, 0, 1, 1])]);

        var report = ColumnScreen.Screen(train, Options);

        Assert.Equal(["flag"], report.Kept.ToArray());
        Assert.Empty(report.Dropped);
    }

    [Fact]
    public void Drops_a_column_with_fewer_non_zero_cells_than_the_minimum()
    {
        // Given the minimum of 2 and a column with one non-zero cell
        var train = TinyTables.FromColumns([("rare", [0, 0, 5, 0]), ("two", [0, 1, 0, 1])]);

        // When screened
        var report = ColumnScreen.Screen(train, Options);

        // Then the rare column is dropped and the one at the minimum kept
        Assert.Equal([new DroppedColumn("rare", DropReason.TooFewNonZero)], report.Dropped.ToArray());
        Assert.Equal(["two"], report.Kept.ToArray());
    }

    [Fact]
    public void Tests_constancy_before_the_non_zero_minimum()
    {
        // An all-zero column also has too few non-zero cells; the first rule names it
        var train = TinyTables.FromColumns([("zeros", [0, 0, 0])]);

        var report = ColumnScreen.Screen(train, new ScreeningOptions(MinNonZero: 3));

        Assert.Equal(DropReason.Constant, Assert.Single(report.Dropped).Reason);
    }

    [Fact]
    public void Drops_a_column_that_repeats_an_earlier_one_and_names_it()
    {
        // Given b and d repeating a, and c with a's rows but another value
        var train = TinyTables.FromColumns(
            [("a", [1, 0, 2, 0]), ("b", [1, 0, 2, 0]), ("c", [1, 0, 3, 0]), ("d", [1, 0, 2, 0])]);

        // When screened
        var report = ColumnScreen.Screen(train, Options);

        // Then both repeats point at the first, kept column
        Assert.Equal(["a", "c"], report.Kept.ToArray());
        Assert.Equal(
            [new DroppedColumn("b", DropReason.Duplicate, "a"), new DroppedColumn("d", DropReason.Duplicate, "a")],
            report.Dropped.ToArray());
        Assert.Equal(2, report.Count(DropReason.Duplicate));
        Assert.Equal(4, report.ColumnsRead);
    }

    [Fact]
    public void Keeps_both_columns_when_their_hashes_collide_but_cells_differ()
    {
        // Given a hash that sends every column to the same bucket
        var train = TinyTables.FromColumns([("a", [1, 0, 2]), ("b", [2, 0, 1]), ("c", [1, 0, 2])]);

        // When screened with it
        var report = ColumnScreen.Screen(train, Options, _ => 42);

        // Then only the true repeat is dropped
        Assert.Equal(["a", "b"], report.Kept.ToArray());
        Assert.Equal([new DroppedColumn("c", DropReason.Duplicate, "a")], report.Dropped.ToArray());
    }

    [Fact]
    public void Applies_the_kept_columns_by_name_to_another_table()
    {
        // Given a report from training and a test table with the same names, other cells, other order
        var train = TinyTables.FromColumns([("a", [1, 0, 2]), ("b", [1, 0, 2]), ("c", [0, 3, 3])]);
        var report = ColumnScreen.Screen(train, Options);
        var test = TinyTables.FromColumns([("c", [9, 0]), ("b", [5, 5]), ("a", [0, 8])], source: "test.csv");

        // When it is applied to both
        var screenedTrain = ColumnScreen.Apply(report, train);
        var screenedTest = ColumnScreen.Apply(report, test);

        // Then both keep the same names in the same order
        Assert.Equal(["a", "c"], screenedTrain.FeatureNames.ToArray());
        Assert.Equal(["a", "c"], screenedTest.FeatureNames.ToArray());
        Assert.Equal([8f], screenedTest.Columns[0].Values.ToArray());
        Assert.Equal([9f], screenedTest.Columns[1].Values.ToArray());
    }

    [Fact]
    public void Apply_names_the_table_missing_a_kept_column()
    {
        var report = new ScreeningReport(1, ["a"], []);
        var table = TinyTables.FromColumns([("b", [1])], source: "other.csv");

        var e = Assert.Throws<InputException>(() => ColumnScreen.Apply(report, table));

        Assert.Equal("other.csv", e.File);
        Assert.Contains("'a'", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Screens_7000_columns_quickly()
    {
        // Given 7,000 columns over 4,000 rows with every tenth a copy of its predecessor
        var random = new Random(7);
        var columns = new List<(string, float[])>();
        for (int c = 0; c < 7000; c++)
        {
            var cells = c % 10 == 9 ? columns[^1].Item2 : new float[4000];
            if (c % 10 != 9)
            {
                for (int r = 0; r < cells.Length; r++)
                {
                    cells[r] = random.NextDouble() < 0.03 ? random.Next(1, 50) : 0;
                }
            }

            columns.Add(($"f{c}", cells));
        }

        var train = TinyTables.FromColumns(columns);

        // When screened
        var watch = System.Diagnostics.Stopwatch.StartNew();
        var report = ColumnScreen.Screen(train, new ScreeningOptions());
        watch.Stop();

        // Then the copies are found and it takes well under a second (a generous bound for one hash and a few compares per column)
        Assert.Equal(700, report.Count(DropReason.Duplicate));
        Assert.True(watch.Elapsed < TimeSpan.FromSeconds(1), $"screening took {watch.Elapsed}");
    }
}
