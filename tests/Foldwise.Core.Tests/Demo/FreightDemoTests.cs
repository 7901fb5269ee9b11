using Foldwise.Core.Data;
using Foldwise.Core.Demo;
using Foldwise.Testing;

namespace Foldwise.Core.Tests.Demo;

public sealed class FreightDemoTests
{
    private static readonly (FeatureTable Train, FeatureTable Test) Quick = FreightDemo.Generate(DemoSize.Quick, seed: 7);

    private static readonly Lazy<(FeatureTable Train, FeatureTable Test)> Full = new(() => FreightDemo.Generate(DemoSize.Full, seed: 7));

    [Fact]
    public void Makes_a_quick_table_of_the_stated_shape()
    {
        var (train, test) = Quick;

        Assert.Equal((800, 400, 3_200, 400), (train.RowCount, train.FeatureCount, test.RowCount, test.FeatureCount));
        Assert.True(train.HasTarget);
        Assert.False(test.HasTarget);
        Assert.Equal(train.FeatureNames.ToArray(), test.FeatureNames.ToArray());
    }

    [Fact]
    public void New_rows_are_further_shippers_of_the_same_world_after_the_test_table()
    {
        // When 50 new rows are drawn for the quick demo's seed
        var rows = FreightDemo.NewRows(DemoSize.Quick, seed: 7, rows: 50);

        // Then they have the demo's columns and no target, their ids follow the test table's, and they are not its rows again
        var (train, test) = Quick;
        Assert.Equal(test.FeatureNames.ToArray(), rows.FeatureNames.ToArray());
        Assert.Equal(test.CategoryNames.ToArray(), rows.CategoryNames.ToArray());
        Assert.False(rows.HasTarget);
        Assert.Equal("S004001", rows.Ids[0]);
        Assert.Equal(50, rows.RowCount);
        Assert.InRange(rows.Density, 0.04, 0.08);
        Assert.NotEqual(test.ToRows().RowColumns(0).ToArray(), rows.ToRows().RowColumns(0).ToArray());
        Assert.Equal(train.RowCount + test.RowCount + 1, int.Parse(rows.Ids[0][1..], System.Globalization.CultureInfo.InvariantCulture));
    }

    [Fact]
    [Trait(Lane.Key, Lane.Slow)]
    public void Makes_a_full_table_wide_sparse_and_with_a_test_table_four_times_longer()
    {
        // Given the full demo
        var (train, test) = Full.Value;

        // Then it is 3,000 × 7,000 at ~94 % zeros, with a test table four times longer
        Assert.Equal((3_000, 7_000), (train.RowCount, train.FeatureCount));
        Assert.Equal(4 * train.RowCount, test.RowCount);
        Assert.InRange(train.Density, 0.055, 0.065);
        Assert.InRange(test.Density, 0.055, 0.065);
        Assert.True(CountConstant(train) >= 5, "constant columns");
        Assert.True(CountDuplicates(train) >= 20, "duplicated columns");
    }

    [Fact]
    public void Is_about_94_percent_zeros_at_the_quick_size_too()
    {
        Assert.InRange(Quick.Train.Density, 0.055, 0.065);
    }

    [Fact]
    public void Includes_constant_and_duplicated_columns()
    {
        var (train, _) = Quick;

        Assert.True(CountConstant(train) >= 3, $"{CountConstant(train)} constant columns");
        Assert.True(CountDuplicates(train) >= 1, $"{CountDuplicates(train)} duplicated columns");
        Assert.Contains(train.Columns, c => c.NonZeroCount == train.RowCount && c.Values.All(v => v == 1));
        Assert.Contains(train.Columns, c => c.NonZeroCount == 0);
    }

    [Fact]
    public void Gives_the_same_tables_for_the_same_seed_and_others_for_another()
    {
        // When the quick demo is generated again with the same seed and with another
        var (again, againTest) = FreightDemo.Generate(DemoSize.Quick, seed: 7);
        var (other, _) = FreightDemo.Generate(DemoSize.Quick, seed: 8);

        // Then the first matches cell for cell and the second does not
        // (Arrays, not ImmutableArrays: xunit compares those by IEquatable, i.e. by the underlying array's reference.)
        Assert.Equal(Quick.Train.Target.ToArray(), again.Target.ToArray());
        Assert.Equal(Quick.Train.Ids.ToArray(), again.Ids.ToArray());
        Assert.True(Quick.Train.Columns.Zip(again.Columns).All(p => p.First.Rows.SequenceEqual(p.Second.Rows) && p.First.Values.SequenceEqual(p.Second.Values)));
        Assert.True(Quick.Test.Columns.Zip(againTest.Columns).All(p => p.First.Rows.SequenceEqual(p.Second.Rows)));
        Assert.False(Quick.Train.Target.SequenceEqual(other.Target));
    }

    [Fact]
    public void Has_a_non_negative_right_skewed_target()
    {
        var target = Quick.Train.Target;
        var sorted = target.Order().ToArray();
        double median = sorted[sorted.Length / 2];

        Assert.All(target, y => Assert.True(y >= 0 && double.IsFinite(y)));
        Assert.True(target.Average() > 1.5 * median, $"mean {target.Average():F0}, median {median:F0}");
        Assert.True(sorted[^1] > 20 * median, "a heavy right tail");
    }

    [Fact]
    public void Holds_whole_counts_under_opaque_names_and_ids()
    {
        var (train, test) = Quick;

        Assert.All(train.Columns, c => Assert.All(c.Values, v => Assert.True(v >= 1 && v == MathF.Round(v))));
        Assert.Equal(("lane_0001", "lane_0400"), (train.FeatureNames[0], train.FeatureNames[^1]));
        Assert.Equal(("S000001", "S000800", "S000801"), (train.Ids[0], train.Ids[^1], test.Ids[0]));
        Assert.Empty(train.Ids.Intersect(test.Ids));
    }

    [Fact]
    public void Records_region_sector_and_channel_as_text_with_some_left_blank()
    {
        var (train, test) = Quick;

        // Then both tables carry the three facts, each with a few levels and some blank cells
        Assert.Equal(["region", "sector", "signing_channel"], train.CategoryNames.ToArray());
        Assert.Equal(train.CategoryNames.ToArray(), test.CategoryNames.ToArray());
        Assert.Equal([4, 8, 4], train.Categories.Select(c => c.Levels.Length).ToArray());
        Assert.All(train.Categories, c => Assert.InRange(c.MissingCount, 0.02 * train.RowCount, 0.3 * train.RowCount));
        Assert.Contains("groceries", train.Categories[1].Levels);

        // And the blank share follows the form: the channel is left empty most often
        Assert.True(train.Categories[2].MissingCount > train.Categories[0].MissingCount, "channel blank more often than region");
    }

    [Fact]
    public void Lets_the_sector_move_the_spend()
    {
        // Given the quick demo's shippers with a sector, and their log spends
        var (train, _) = Quick;
        var sector = train.Categories[1];
        int[] rows = [.. Enumerable.Range(0, train.RowCount).Where(r => sector.Codes[r] != CategoryColumn.Missing)];
        int[] codes = [.. rows.Select(r => sector.Codes[r])];
        double[] logSpend = [.. rows.Select(r => Math.Log(train.Target[r]))];

        // When the spread of the sectors' mean log spends is compared with that of 20 seeded shuffles of the labels
        double actual = SpreadOfGroupMeans(codes, logSpend);
        var random = new Random(5);
        double shuffled = Enumerable.Range(0, 20).Max(_ => SpreadOfGroupMeans([.. codes.OrderBy(_ => random.Next())], logSpend));

        // Then the sector explains more than any shuffle does
        Assert.True(actual > shuffled, $"sector spread {actual:F3}, largest shuffled {shuffled:F3}");
    }

    private static double SpreadOfGroupMeans(int[] codes, double[] values)
    {
        var means = codes.Zip(values).GroupBy(p => p.First).Select(g => g.Average(p => p.Second)).ToArray();
        double mean = means.Average();
        return means.Sum(m => (m - mean) * (m - mean)) / means.Length;
    }

    private static int CountConstant(FeatureTable table) =>
        table.Columns.Count(c => c.NonZeroCount == 0 || (c.NonZeroCount == table.RowCount && c.Values.All(v => v == c.Values[0])));

    private static int CountDuplicates(FeatureTable table) =>
        table.Columns.Where(c => c.NonZeroCount > 0)
            .GroupBy(c => string.Join(';', c.Rows.Zip(c.Values, (r, v) => $"{r}:{v}")))
            .Sum(g => g.Count() - 1);
}
