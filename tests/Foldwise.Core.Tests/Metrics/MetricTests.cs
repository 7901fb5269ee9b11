using Foldwise.Core.Metrics;

namespace Foldwise.Core.Tests.Metrics;

public sealed class MetricTests
{
    // y_true / y_pred of the root_mean_squared_log_error example — scikit-learn documentation.
    private static readonly double[] SklearnTrue = [3, 5, 2.5, 7];
    private static readonly double[] SklearnPredicted = [2.5, 5, 4, 8];

    [Fact]
    public void Rmsle_on_the_original_scale_matches_the_scikit_learn_example()
    {
        // When the example is scored on the original scale
        double score = Metric.Rmsle.ScoreOriginal(SklearnTrue, SklearnPredicted);

        // Then it is 0.19932 — scikit-learn documentation, root_mean_squared_log_error
        Assert.Equal(0.19932, score, 5);
    }

    [Fact]
    public void Rmsle_on_the_fitting_scale_gives_the_same_score()
    {
        // Given the example moved to the fitting scale with Forward
        var actual = SklearnTrue.Select(Metric.Rmsle.Forward).ToArray();
        var predicted = SklearnPredicted.Select(Metric.Rmsle.Forward).ToArray();

        // When it is scored there
        double score = Metric.Rmsle.Score(actual, predicted);

        // Then it matches the original-scale score
        Assert.Equal(0.19932, score, 5);
        Assert.Equal(Metric.Rmsle.ScoreOriginal(SklearnTrue, SklearnPredicted), score, 12);
    }

    [Fact]
    public void Rmse_of_a_small_case_is_the_root_of_the_mean_squared_error()
    {
        // Hand-computed: errors 0.5, -0.5, 0, -1 → mean square 0.375 → root 0.612372…
        double score = Metric.Rmse.Score([3, -0.5, 2, 7], [2.5, 0, 2, 8]);

        Assert.Equal(Math.Sqrt(0.375), score, 12);
        Assert.Equal(score, Metric.Rmse.ScoreOriginal([3, -0.5, 2, 7], [2.5, 0, 2, 8]), 12);
    }

    [Fact]
    public void Mae_of_a_small_case_is_the_mean_absolute_error()
    {
        // Hand-computed: |0.5| + |-0.5| + 0 + |-1| = 2, over 4 rows = 0.5
        double score = Metric.Mae.Score([3, -0.5, 2, 7], [2.5, 0, 2, 8]);

        Assert.Equal(0.5, score, 12);
    }

    [Fact]
    public void Rmsle_clamps_a_negative_prediction_on_the_fitting_scale_to_zero()
    {
        // Given an actual log1p(1) = ln 2 and a prediction below the scale's floor
        // When it is scored
        double score = Metric.Rmsle.Score([Math.Log(2)], [-5]);

        // Then the prediction counts as 0, as the written file would hold it
        Assert.Equal(Math.Log(2), score, 12);
    }

    [Fact]
    public void Rmsle_clamps_a_negative_prediction_on_the_original_scale_to_zero()
    {
        // Given an actual 1 and a negative prediction, which log1p could not take below -1
        double score = Metric.Rmsle.ScoreOriginal([1], [-3]);

        // Then the prediction is scored as 0
        Assert.Equal(Math.Log(2), score, 12);
    }

    [Fact]
    public void Rmse_does_not_clamp_negative_predictions()
    {
        Assert.Equal(4, Metric.Rmse.Score([1], [-3]), 12);
    }

    [Fact]
    public void Inverse_undoes_forward_and_clamps_at_zero_under_rmsle()
    {
        Assert.Equal(7.5, Metric.Rmsle.Inverse(Metric.Rmsle.Forward(7.5)), 12);
        Assert.Equal(0, Metric.Rmsle.Inverse(-2));
        Assert.Equal(-2, Metric.Rmse.Inverse(Metric.Rmse.Forward(-2)));
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    public void Every_metric_rejects_a_target_that_is_not_finite(double y)
    {
        foreach (var metric in new[] { Metric.Rmsle, Metric.Rmse, Metric.Mae })
        {
            Assert.Contains("not a finite number", metric.TargetProblem(y), StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Only_rmsle_rejects_a_negative_target()
    {
        Assert.Equal("target -1 is negative, which RMSLE cannot score", Metric.Rmsle.TargetProblem(-1));
        Assert.Null(Metric.Rmse.TargetProblem(-1));
        Assert.Null(Metric.Mae.TargetProblem(-1));
    }

    [Fact]
    public void Rmsle_accepts_a_zero_target()
    {
        Assert.Null(Metric.Rmsle.TargetProblem(0));
    }

    [Fact]
    public void Score_rejects_vectors_of_different_or_zero_length()
    {
        Assert.Throws<ArgumentException>(() => Metric.Rmse.Score([1, 2], [1]));
        Assert.Throws<ArgumentException>(() => Metric.Rmse.Score([], []));
    }

    [Fact]
    public void For_returns_the_metric_of_each_kind()
    {
        Assert.Same(Metric.Rmsle, Metric.For(MetricKind.Rmsle));
        Assert.Same(Metric.Rmse, Metric.For(MetricKind.Rmse));
        Assert.Same(Metric.Mae, Metric.For(MetricKind.Mae));
    }
}
