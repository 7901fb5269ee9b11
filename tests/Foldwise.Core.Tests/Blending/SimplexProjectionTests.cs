using Foldwise.Core.Blending;

namespace Foldwise.Core.Tests.Blending;

public sealed class SimplexProjectionTests
{
    [Fact]
    public void Projects_the_worked_example()
    {
        // Given v = (0.4, 0.3, 0.6): sorted 0.6, 0.4, 0.3, ρ = 3, θ = (1.3 − 1)/3 = 0.1
        // When
        var w = SimplexProjection.Project([0.4, 0.3, 0.6]);

        // Then (0.3, 0.2, 0.5) — Duchi et al., ICML 2008, Figure 1 algorithm
        Assert.Equal(0.3, w[0], 1e-15);
        Assert.Equal(0.2, w[1], 1e-15);
        Assert.Equal(0.5, w[2], 1e-15);
    }

    [Fact]
    public void Leaves_a_point_of_the_simplex_where_it_is()
    {
        var w = SimplexProjection.Project([0.25, 0.0, 0.75]);

        Assert.Equal([0.25, 0.0, 0.75], w);
    }

    [Fact]
    public void Clips_a_far_away_point_to_a_vertex()
    {
        var w = SimplexProjection.Project([-3.0, 5.0, 1.0]);

        Assert.Equal([0.0, 1.0, 0.0], w);
    }

    [Fact]
    public void Finds_the_closest_point_of_the_simplex()
    {
        var random = new Random(3);
        for (int trial = 0; trial < 50; trial++)
        {
            // Given a random vector
            var v = Enumerable.Range(0, 6).Select(_ => 2 * BlendFakes.Normal(random)).ToArray();

            // When
            var w = SimplexProjection.Project(v);

            // Then it is on the simplex and no random simplex point is closer
            Assert.All(w, x => Assert.True(x >= 0));
            Assert.Equal(1.0, w.Sum(), 1e-12);
            double distance = Distance(v, w);
            for (int other = 0; other < 200; other++)
            {
                var raw = Enumerable.Range(0, 6).Select(_ => -Math.Log(1 - random.NextDouble())).ToArray();
                var point = raw.Select(x => x / raw.Sum()).ToArray();
                Assert.True(distance <= Distance(v, point) + 1e-12);
            }
        }
    }

    [Fact]
    public void Rejects_an_empty_vector()
    {
        Assert.Throws<ArgumentException>(() => SimplexProjection.Project([]));
    }

    private static double Distance(double[] a, double[] b) => Math.Sqrt(a.Zip(b, (x, y) => (x - y) * (x - y)).Sum());
}
