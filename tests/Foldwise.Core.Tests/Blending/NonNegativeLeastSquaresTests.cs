using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class NonNegativeLeastSquaresTests
{
    // A = [[1,0],[1,0],[0,1]] given as its two columns.
    private static readonly double[][] DocumentationMatrix = [[1, 1, 0], [0, 0, 1]];

    [Fact]
    public void Matches_the_scipy_documentation_example()
    {
        // Given b = [2, 1, 1]
        // When
        var result = NonNegativeLeastSquares.Solve(DocumentationMatrix, [2.0, 1.0, 1.0]);

        // Then x = [1.5, 1] and residual norm 0.7071067811865475 — scipy.optimize.nnls documentation, Examples
        Assert.Equal(1.5, result.Weights[0], 1e-15);
        Assert.Equal(1.0, result.Weights[1], 1e-15);
        Assert.Equal(0.7071067811865475, Math.Sqrt(result.Objective), 1e-15);
    }

    [Fact]
    public void Matches_the_scipy_documentation_example_with_a_negative_target()
    {
        // Given b = [-1, -1, -1]
        // When
        var result = NonNegativeLeastSquares.Solve(DocumentationMatrix, [-1.0, -1.0, -1.0]);

        // Then x = [0, 0] and residual norm 1.7320508075688772 — scipy.optimize.nnls documentation, Examples
        Assert.Equal([0.0, 0.0], result.Weights);
        Assert.Equal(1.7320508075688772, Math.Sqrt(result.Objective), 1e-15);
    }

    [Theory]
    [MemberData(nameof(ReferenceNames))]
    public void Equals_scipy_on_the_reference_problems(string name)
    {
        // Given a seeded problem and scipy.optimize.nnls's exact answer (see reference/make_reference.py)
        var problem = ReferenceProblems.Named(name);

        // When
        var result = NonNegativeLeastSquares.Solve(problem.Columns, problem.Target);

        // Then the objectives agree to 1e-9 relative
        double reference = problem.NnlsObjective;
        Assert.True(Math.Abs(result.Objective - reference) <= (1e-9 * reference) + 1e-12, $"{result.Objective:R} vs scipy {reference:R}");
        Assert.All(result.Weights, w => Assert.True(w >= 0));
    }

    public static TheoryData<string> ReferenceNames() => ReferenceProblems.Names();

    [Fact]
    public void Duplicated_columns_leave_the_optimum_unchanged()
    {
        // Given a problem and the same with every column twice
        var (columns, y) = BlendFakes.Problem(21, 10, 200);
        var plain = NonNegativeLeastSquares.Solve(columns, y);

        // When
        var result = NonNegativeLeastSquares.Solve([.. columns, .. columns], y);

        // Then
        Assert.Equal(plain.Objective, result.Objective, 1e-10 * plain.Objective);
        Assert.All(result.Weights, w => Assert.True(w >= 0));
    }

    [Fact]
    public void Is_never_worse_than_the_simplex()
    {
        // Given (the simplex is a subset of w ≥ 0)
        var (columns, y) = BlendFakes.Problem(22, 15, 300);

        // When
        var nnls = NonNegativeLeastSquares.Solve(columns, y);
        var simplex = SimplexLeastSquares.Solve(columns, y);

        // Then
        Assert.True(nnls.Objective <= simplex.Objective * (1 + 1e-12));
    }
}
