using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class GreedySelectionTests
{
    [Fact]
    public void Pairs_two_columns_whose_errors_cancel()
    {
        // Given y = 0 and columns with errors +1 and −1 (hand-derived: round 1 ties at error 2 and takes
        // the first column; round 2 adding the second gives the average 0, adding the first again gives 2)
        double[][] columns = [[1, 1], [-1, -1]];

        // When
        var result = GreedySelection.Solve(columns, [0.0, 0.0], rounds: 2);

        // Then
        Assert.Equal([0.5, 0.5], result.Weights);
        Assert.Equal(0.0, result.Objective);
    }

    [Fact]
    public void Takes_the_best_single_column_in_one_round()
    {
        // Given
        var (columns, y) = BlendFakes.Problem(31, 12, 200);
        int best = Enumerable.Range(0, 12).MinBy(j => BlendFakes.SumOfSquares([columns[j]], [1.0], y));

        // When
        var result = GreedySelection.Solve(columns, y, rounds: 1);

        // Then
        Assert.Equal(1.0, result.Weights[best]);
    }

    [Fact]
    public void Gives_weights_in_steps_of_one_over_the_rounds_and_never_beats_the_exact_simplex()
    {
        // Given
        var (columns, y) = BlendFakes.Problem(32, 20, 300);

        // When
        var greedy = GreedySelection.Solve(columns, y, rounds: 40);
        var exact = SimplexLeastSquares.Solve(columns, y);

        // Then
        Assert.All(greedy.Weights, w => Assert.Equal(Math.Round(w * 40), w * 40, 1e-12));
        Assert.Equal(1.0, greedy.Weights.Sum(), 1e-12);
        Assert.True(greedy.Objective >= exact.Objective * (1 - 1e-12));
    }

    [Fact]
    public void Rejects_zero_rounds()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => GreedySelection.Solve([[1.0]], [1.0], rounds: 0));
    }
}
