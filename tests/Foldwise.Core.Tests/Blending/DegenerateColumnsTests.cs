using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class DegenerateColumnsTests
{
    [Theory]
    [InlineData(1e-6)]
    [InlineData(1e-10)]
    [InlineData(1e-14)]
    [InlineData(0.0)]
    public void Near_copies_and_near_affine_combinations_never_make_the_optimum_worse(double perturbation)
    {
        for (int seed = 0; seed < 10; seed++)
        {
            // Given a base problem and the same with near-copies, near-midpoints and near-extrapolations added
            var (columns, y) = BlendFakes.Problem(100 + seed, 4 + seed, 150);
            var random = new Random(seed);
            var grown = columns.ToList();
            for (int extra = 0; extra < 6; extra++)
            {
                var a = columns[random.Next(columns.Length)];
                var b = columns[random.Next(columns.Length)];
                double t = extra % 3 == 0 ? 1 : extra % 3 == 1 ? 0.5 : 1.5;
                grown.Add([.. a.Select((x, i) => (t * x) + ((1 - t) * b[i]) + (perturbation * BlendFakes.Normal(random)))]);
            }

            // When
            var simplexBase = SimplexLeastSquares.Solve(columns, y);
            var simplex = SimplexLeastSquares.Solve(grown, y);
            var nnlsBase = NonNegativeLeastSquares.Solve(columns, y);
            var nnls = NonNegativeLeastSquares.Solve(grown, y);

            // Then the larger column set is at least as good (its feasible set contains the base one's).
            // NNLS gets 1e-10: it solves on the raw Gram, whose diagonal is ~100× the objective here and
            // whose conditioning is P's squared, so a 1e-10 near-copy is below what it can resolve
            // (measured on seed 1, 1e-10: 2.6e-11 relative above scipy's QR-based nnls, cond(P) = 3e11).
            Assert.True(simplex.Objective <= simplexBase.Objective * (1 + 1e-12), $"simplex seed {seed}: {simplex.Objective:R} > {simplexBase.Objective:R}");
            Assert.True(nnls.Objective <= nnlsBase.Objective * (1 + 1e-10), $"nnls seed {seed}: {nnls.Objective:R} > {nnlsBase.Objective:R}");
            SimplexLeastSquaresTests.AssertOnSimplex(simplex.Weights);
            Assert.All(nnls.Weights, w => Assert.True(w >= 0));
        }
    }
}
