using Foldwise.Core.Folds;

namespace Foldwise.Core.Tests.Folds;

public sealed class StratifiedFoldPlannerTests
{
    // A right-skewed target on the log1p scale, like the field's data.
    private static double[] SkewedTarget(int rows, int seed)
    {
        var random = new Random(seed);
        return [.. Enumerable.Range(0, rows).Select(_ => Math.Log(1 + Math.Exp(12 + (2 * Gaussian(random)))))];
    }

    private static double Gaussian(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());

    [Theory]
    [InlineData(10, 2)]
    [InlineData(103, 5)]
    [InlineData(3001, 5)]
    [InlineData(7, 7)]
    public void Puts_every_row_in_exactly_one_fold_with_sizes_within_one(int rows, int folds)
    {
        // When a plan is made
        var plan = StratifiedFoldPlanner.Create(SkewedTarget(rows, 1), folds, seed: 11);

        // Then every row has one fold in range, and fold sizes differ by at most one
        Assert.Equal(rows, plan.RowCount);
        Assert.Equal(folds, plan.FoldCount);
        Assert.All(plan.FoldOfRow, f => Assert.InRange(f, 0, folds - 1));
        var sizes = Enumerable.Range(0, folds).Select(f => plan.ValidationRows(f).Length).ToArray();
        Assert.Equal(rows, sizes.Sum());
        Assert.True(sizes.Max() - sizes.Min() <= 1, $"sizes {string.Join(",", sizes)}");
    }

    [Fact]
    public void Gives_each_fold_a_target_mean_close_to_the_whole()
    {
        // Given 3,001 skewed targets with a spread of about 2 on the fitting scale
        var target = SkewedTarget(3001, 3);
        double mean = target.Average();

        // When split five ways
        var plan = StratifiedFoldPlanner.Create(target, 5, seed: 5);

        // Then each fold's mean is within 0.02 of the whole (a random split's error would be about 2 / √600 ≈ 0.08)
        for (int f = 0; f < 5; f++)
        {
            double foldMean = plan.ValidationRows(f).Average(r => target[r]);
            Assert.InRange(foldMean, mean - 0.02, mean + 0.02);
        }
    }

    [Fact]
    public void Makes_the_same_plan_from_the_same_seed()
    {
        var target = SkewedTarget(500, 2);

        var first = StratifiedFoldPlanner.Create(target, 5, seed: 9);
        var second = StratifiedFoldPlanner.Create(target, 5, seed: 9);

        Assert.Equal(first.FoldOfRow.ToArray(), second.FoldOfRow.ToArray());
        Assert.Equal(9, first.Seed);
    }

    [Fact]
    public void Makes_a_different_plan_from_a_different_seed()
    {
        var target = SkewedTarget(500, 2);

        var first = StratifiedFoldPlanner.Create(target, 5, seed: 9);
        var second = StratifiedFoldPlanner.Create(target, 5, seed: 10);

        Assert.NotEqual(first.FoldOfRow.ToArray(), second.FoldOfRow.ToArray());
    }

    [Fact]
    public void Spreads_equal_targets_over_all_folds()
    {
        // Given a target with one value only, so stratifying has nothing to go on
        var plan = StratifiedFoldPlanner.Create(Enumerable.Repeat(1.0, 40).ToArray(), 4, seed: 1);

        // Then the folds still come out even
        Assert.All(Enumerable.Range(0, 4), f => Assert.Equal(10, plan.ValidationRows(f).Length));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(0)]
    [InlineData(11)]
    public void Rejects_fewer_than_two_folds_or_more_folds_than_rows(int folds)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => StratifiedFoldPlanner.Create(new double[10], folds, seed: 1));
    }

    [Fact]
    public void Rejects_a_target_that_is_not_finite()
    {
        Assert.Throws<ArgumentException>(() => StratifiedFoldPlanner.Create([1, double.NaN, 2], 2, seed: 1));
    }
}
