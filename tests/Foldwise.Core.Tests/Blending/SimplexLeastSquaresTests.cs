using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class SimplexLeastSquaresTests
{
    [Fact]
    public void Solves_the_hand_derived_example_exactly()
    {
        // Given P rows [[3,2,0],[1,2,0],[1,2,0],[1,0,5]] and y = [3,1,2,0]
        double[][] columns = [[3, 1, 1, 1], [2, 2, 2, 0], [0, 0, 0, 5]];
        double[] y = [3, 1, 2, 0];

        // When
        var result = SimplexLeastSquares.Solve(columns, y);

        // Then w = (1/2, 1/2, 0) with squared error 1 — hand-derived from the KKT conditions:
        // residual (1/2, -1/2, 1/2, -1/2), multipliers 0, 0 and 7/2 for the third column.
        Assert.Equal(0.5, result.Weights[0], 1e-14);
        Assert.Equal(0.5, result.Weights[1], 1e-14);
        Assert.Equal(0.0, result.Weights[2]);
        Assert.Equal(1.0, result.Objective, 1e-13);
    }

    [Theory]
    [MemberData(nameof(ReferenceNames))]
    public void Is_at_least_as_good_as_scipy_on_the_reference_problems(string name)
    {
        // Given a seeded problem and scipy's answer (SLSQP and an exact NNLS reduction, see reference/make_reference.py)
        var problem = ReferenceProblems.Named(name);

        // When
        var result = SimplexLeastSquares.Solve(problem.Columns, problem.Target);

        // Then we are no worse, and equal where scipy's answer passed its KKT check
        double reference = problem.SimplexObjective;
        Assert.True(result.Objective <= (reference * (1 + 1e-9)) + 1e-12, $"{result.Objective:R} > scipy {reference:R}");
        if (problem.SimplexExact)
        {
            Assert.True(result.Objective >= (reference * (1 - 1e-9)) - 1e-12, $"{result.Objective:R} < exact {reference:R}?");
        }

        AssertOnSimplex(result.Weights);
        Assert.Equal(BlendFakes.SumOfSquares(problem.Columns, result.Weights, problem.Target), result.Objective, 1e-9 * reference);
    }

    public static TheoryData<string> ReferenceNames() => ReferenceProblems.Names();

    [Theory]
    [InlineData(1, 5, 100)]
    [InlineData(2, 30, 400)]
    [InlineData(3, 60, 250)]
    public void Keeps_weights_on_the_simplex(int seed, int k, int n)
    {
        // Given
        var (columns, y) = BlendFakes.Problem(seed, k, n);

        // When
        var result = SimplexLeastSquares.Solve(columns, y);

        // Then
        AssertOnSimplex(result.Weights);
    }

    [Fact]
    public void Cannot_be_improved_by_any_nearby_point_of_the_simplex()
    {
        // Given the optimum of a problem with many columns
        var (columns, y) = BlendFakes.Problem(7, 25, 300);
        var result = SimplexLeastSquares.Solve(columns, y);
        var random = new Random(11);

        // When moved to 500 random nearby points of the simplex
        for (int trial = 0; trial < 500; trial++)
        {
            var moved = result.Weights.Select(w => w + (0.01 * BlendFakes.Normal(random))).ToArray();
            var other = SimplexProjection.Project(moved);

            // Then none is better (to rounding)
            Assert.True(BlendFakes.SumOfSquares(columns, other, y) >= result.Objective * (1 - 1e-12));
        }
    }

    [Fact]
    public void Duplicated_columns_leave_the_optimum_unchanged()
    {
        // Given a problem, and the same with its best columns repeated three times each
        var (columns, y) = BlendFakes.Problem(5, 8, 200);
        var plain = SimplexLeastSquares.Solve(columns, y);
        var duplicated = columns.Concat(columns).Concat(columns).ToArray();

        // When
        var result = SimplexLeastSquares.Solve(duplicated, y);

        // Then the objective is the same and each column's copies share its weight
        Assert.Equal(plain.Objective, result.Objective, 1e-10 * plain.Objective);
        for (int j = 0; j < columns.Length; j++)
        {
            Assert.Equal(plain.Weights[j], result.Weights[j] + result.Weights[j + 8] + result.Weights[j + 16], 1e-7);
        }

        AssertOnSimplex(result.Weights);
    }

    [Fact]
    public void Collinear_columns_inside_the_hull_change_nothing()
    {
        // Given a problem and added columns that are convex combinations of its columns (affinely dependent)
        var (columns, y) = BlendFakes.Problem(9, 6, 150);
        var plain = SimplexLeastSquares.Solve(columns, y);
        var mixed = columns.ToList();
        mixed.Add([.. columns[0].Zip(columns[1], (a, b) => (0.5 * a) + (0.5 * b))]);
        mixed.Add([.. columns[2].Zip(columns[3], (a, b) => (0.25 * a) + (0.75 * b))]);
        mixed.Add([.. Enumerable.Range(0, y.Length).Select(i => columns.Average(c => c[i]))]);

        // When
        var result = SimplexLeastSquares.Solve(mixed, y);

        // Then the optimum over the same hull is the same
        Assert.Equal(plain.Objective, result.Objective, 1e-10 * plain.Objective);
        AssertOnSimplex(result.Weights);
    }

    [Fact]
    public void Puts_all_weight_on_a_column_equal_to_the_target()
    {
        // Given a column that is y itself among noisy ones
        var (columns, y) = BlendFakes.Problem(4, 5, 120);
        var withTruth = columns.Append((double[])y.Clone()).Append((double[])y.Clone()).ToArray();

        // When
        var result = SimplexLeastSquares.Solve(withTruth, y);

        // Then
        Assert.Equal(0, result.Objective, 1e-20);
        Assert.Equal(1.0, result.Weights[5] + result.Weights[6], 1e-12);
    }

    [Fact]
    public void Gives_a_single_column_weight_one()
    {
        var result = SimplexLeastSquares.Solve([[1.0, 2.0, 4.0]], [1.0, 1.0, 1.0]);

        Assert.Equal([1.0], result.Weights);
        Assert.Equal(10.0, result.Objective, 1e-14);
    }

    [Fact]
    public void Rejects_columns_that_do_not_match_the_target()
    {
        Assert.Throws<ArgumentException>(() => SimplexLeastSquares.Solve([], [1.0]));
        Assert.Throws<ArgumentException>(() => SimplexLeastSquares.Solve([[1.0, 2.0]], [1.0]));
        Assert.Throws<ArgumentException>(() => SimplexLeastSquares.Solve([[1.0, double.NaN]], [1.0, 2.0]));
    }

    internal static void AssertOnSimplex(double[] weights)
    {
        Assert.All(weights, w => Assert.True(w >= 0, $"negative weight {w}"));
        Assert.True(Math.Abs(weights.Sum() - 1) <= 1e-12, $"weights sum to {weights.Sum():R}");
    }
}
