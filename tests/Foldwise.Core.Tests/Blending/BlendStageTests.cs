using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;

namespace Foldwise.Core.Tests.Blending;

public sealed class BlendStageTests
{
    [Fact]
    public void Refuses_an_empty_pool_clearly()
    {
        var input = new BlendInput(new BlendOptions(), [], [1.0, 2.0], BlendFakes.RoundRobin(2, 2), Metric.Rmse);

        var error = Assert.Throws<InvalidOperationException>(() => BlendStage.Run(input));

        Assert.Contains("pool is empty", error.Message);
    }

    [Theory]
    [InlineData(BlendMode.Simplex)]
    [InlineData(BlendMode.NonNegative)]
    [InlineData(BlendMode.Greedy)]
    public void Gives_a_pool_of_one_weight_one(BlendMode mode)
    {
        // Given one candidate
        var (columns, y) = BlendFakes.Problem(41, 1, 100);
        var input = Input(columns, y, 5, Metric.Rmse, mode);

        // When
        var result = BlendStage.Run(input);

        // Then it is the blend, in sample and nested alike
        Assert.Equal([1.0], result.Weights);
        double single = Metric.Rmse.Score(y, columns[0]);
        Assert.Equal(single, result.Summary.InSampleScore);
        Assert.Equal(single, result.Summary.NestedScore);
        Assert.Equal(single, result.Summary.BestSingleScore);
        Assert.Equal(100, result.Summary.BestSingleTrialId);
    }

    [Theory]
    [InlineData(42, MetricKind.Rmse)]
    [InlineData(43, MetricKind.Rmsle)]
    [InlineData(44, MetricKind.Rmsle)]
    public void Scores_the_blend_in_sample_no_worse_than_the_best_single_trial(int seed, MetricKind kind)
    {
        // Given nine candidates (log-scale target around 3–6, so clamping at 0 never bites)
        var (columns, y) = BlendFakes.Problem(seed, 9, 400);
        var metric = Metric.For(kind);

        // When
        var result = BlendStage.Run(Input(columns, y, 5, metric));

        // Then
        var summary = result.Summary;
        double best = columns.Min(c => metric.Score(y, c));
        Assert.Equal(best, summary.BestSingleScore);
        Assert.True(summary.InSampleScore <= summary.BestSingleScore, $"{summary.InSampleScore} > {summary.BestSingleScore}");
        Assert.True(summary.NestedScore >= summary.InSampleScore, "the nested estimate should not beat the in-sample fit here");
        SimplexLeastSquaresTests.AssertOnSimplex(result.Weights);
        Assert.Equal(result.Weights, summary.Members.Select(m => m.Weight));
        Assert.Equal(Enumerable.Range(100, 9), summary.Members.Select(m => m.TrialId));
    }

    [Fact]
    public void The_nested_fit_for_a_fold_never_sees_that_fold()
    {
        // Given a leaky column: equal to y on fold 0, and elsewhere an honest column's error plus 0.5.
        // Without fold 0 its multiplier is 0.5·Σe > 0 so it gets no weight; a fit that saw fold 0's
        // rows (where its error is 0) would give it weight, as the in-sample fit does.
        const int n = 200;
        var plan = BlendFakes.RoundRobin(n, 4);
        var y = Enumerable.Range(0, n).Select(i => 3 + Math.Sin(i)).ToArray();
        var error = Enumerable.Range(0, n).Select(i => ((i / 4) % 2 == 0 ? 0.5 : -0.5) + 0.05).ToArray();
        var honest = y.Select((t, i) => t + error[i]).ToArray();
        var leaky = y.Select((t, i) => plan.FoldOfRow[i] == 0 ? t : t + error[i] + 0.5).ToArray();
        var input = Input([leaky, honest], y, plan, Metric.Rmse);

        // When
        var result = BlendStage.Run(input);

        // Then fold 0 is predicted by the honest column alone, while fits that include fold 0 use the leak
        Assert.Equal([0.0, 1.0], result.NestedWeights[0]);
        var foldZero = plan.ValidationRows(0).ToArray();
        double honestOnFoldZero = Metric.Rmse.Score(foldZero.Select(r => y[r]).ToArray(), foldZero.Select(r => honest[r]).ToArray());
        Assert.Equal(honestOnFoldZero, result.Summary.NestedFoldScores[0]);
        Assert.True(result.Weights[0] > 0.1, $"in-sample weight on the leaky column {result.Weights[0]}");
        Assert.True(result.NestedWeights[1][0] > 0.1, $"fold 1's nested weight on the leaky column {result.NestedWeights[1][0]}");
    }

    [Theory]
    [InlineData(BlendMode.Simplex)]
    [InlineData(BlendMode.NonNegative)]
    [InlineData(BlendMode.Greedy)]
    public void Nested_weights_equal_a_fit_on_the_other_folds_rows_alone(BlendMode mode)
    {
        // Given
        var (columns, y) = BlendFakes.Problem(45, 6, 300);
        var plan = BlendFakes.RoundRobin(300, 3);

        // When
        var result = BlendStage.Run(Input(columns, y, plan, Metric.Rmse, mode));

        // Then each fold's weights are what the public solver gives on the sliced training rows
        for (int f = 0; f < 3; f++)
        {
            var train = plan.TrainRows(f).ToArray();
            var sliced = columns.Select(c => train.Select(r => c[r]).ToArray()).ToArray();
            var target = train.Select(r => y[r]).ToArray();
            var expected = mode switch
            {
                BlendMode.Simplex => SimplexLeastSquares.Solve(sliced, target),
                BlendMode.NonNegative => NonNegativeLeastSquares.Solve(sliced, target),
                _ => GreedySelection.Solve(sliced, target, BlendStage.GreedyRounds),
            };
            for (int j = 0; j < columns.Length; j++)
            {
                Assert.Equal(expected.Weights[j], result.NestedWeights[f][j], 1e-9);
            }
        }

        // And the nested score is the metric on the pooled nested predictions
        Assert.Equal(Metric.Rmse.Score(y, result.NestedOutOfFold), result.Summary.NestedScore);
        Assert.Equal(Metric.Rmse.Score(y, result.OutOfFold), result.Summary.InSampleScore);
        Assert.Equal(mode, result.Summary.Mode);
        Assert.Equal(3, result.Summary.NestedFoldScores.Length);
    }

    [Fact]
    public void Non_negative_weights_fit_in_sample_at_least_as_well_as_the_simplex()
    {
        var (columns, y) = BlendFakes.Problem(46, 8, 300);

        var simplex = BlendStage.Run(Input(columns, y, 5, Metric.Rmse, BlendMode.Simplex));
        var nnls = BlendStage.Run(Input(columns, y, 5, Metric.Rmse, BlendMode.NonNegative));

        Assert.True(nnls.Summary.InSampleScore <= simplex.Summary.InSampleScore * (1 + 1e-12));
        Assert.All(nnls.Weights, w => Assert.True(w >= 0));
    }

    [Fact]
    public void Breaks_a_best_single_tie_by_the_lower_trial_id()
    {
        // Given two identical candidates, the better one listed first with the higher id
        var (columns, y) = BlendFakes.Problem(47, 2, 100);
        BlendCandidate[] pool = [new(9, "a", columns[0]), new(4, "b", columns[0]), new(2, "c", columns[1])];
        var input = new BlendInput(new BlendOptions(), pool, y, BlendFakes.RoundRobin(100, 4), Metric.Rmse);
        int better = Metric.Rmse.Score(y, columns[0]) <= Metric.Rmse.Score(y, columns[1]) ? 4 : 2;

        // When
        var result = BlendStage.Run(input);

        // Then
        Assert.Equal(better, result.Summary.BestSingleTrialId);
    }

    [Fact]
    public void Combines_test_vectors_by_weight()
    {
        var combined = BlendStage.Combine([0.25, 0.75, 0], [[4.0, 8.0], [0.0, 4.0], [100.0, 100.0]]);

        Assert.Equal([1.0, 5.0], combined);
        Assert.Throws<ArgumentException>(() => BlendStage.Combine([1.0], [[1.0], [2.0]]));
        Assert.Throws<ArgumentException>(() => BlendStage.Combine([0.5, 0.5], [[1.0], [2.0, 3.0]]));
    }

    [Fact]
    public void Rejects_a_fold_plan_for_other_rows()
    {
        var (columns, y) = BlendFakes.Problem(48, 2, 100);

        Assert.Throws<ArgumentException>(() => BlendStage.Run(Input(columns, y, BlendFakes.RoundRobin(99, 3), Metric.Rmse)));
    }

    private static BlendInput Input(double[][] columns, double[] y, int folds, Metric metric, BlendMode mode = BlendMode.Simplex) =>
        Input(columns, y, BlendFakes.RoundRobin(y.Length, folds), metric, mode);

    private static BlendInput Input(double[][] columns, double[] y, global::Foldwise.Core.Folds.FoldPlan plan, Metric metric, BlendMode mode = BlendMode.Simplex) =>
        new(new BlendOptions(mode), [.. columns.Select((c, j) => new BlendCandidate(100 + j, j % 2 == 0 ? "lightgbm" : "fasttree", c))], y, plan, metric);
}
