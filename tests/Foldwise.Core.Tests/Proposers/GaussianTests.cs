using Foldwise.Core.Proposers;

namespace Foldwise.Core.Tests.Proposers;

public sealed class GaussianTests
{
    [Theory]
    // Standard normal CDF values — Abramowitz & Stegun, Handbook of Mathematical Functions (1964), Table 26.1
    [InlineData(0.0, 0.5)]
    [InlineData(1.0, 0.8413447461)]
    [InlineData(-1.96, 0.0249978951)]
    [InlineData(2.5, 0.9937903347)]
    [InlineData(-4.0, 0.0000316712)]
    public void Computes_the_normal_distribution_function(double z, double expected) =>
        Assert.Equal(expected, Gaussian.Cdf(z), 6);

    [Fact]
    public void Renormalises_a_truncated_kernel_so_the_density_integrates_to_one()
    {
        // Given a Parzen density of three points on [0, 2] (kernels near the edges lose mass outside)
        var density = ParzenEstimator.Fit([0.05, 0.1, 1.9], 0, 2, wideKernelWeight: 1);

        // Then its integral over [0, 2] is one (midpoint rule, 20,000 steps)
        double sum = 0, h = 2.0 / 20000;
        for (int i = 0; i < 20000; i++)
        {
            sum += density.Density((i + 0.5) * h) * h;
        }

        Assert.Equal(1.0, sum, 3);
        Assert.Equal(4, density.Kernels);
    }
}
