using Foldwise.Core.Proposers;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

public sealed class ProductKernelDensityTests
{
    private static readonly TpeDimension[] Square =
    [
        new(0, ParameterRange.Linear("x", 0, 1)),
        new(1, ParameterRange.Linear("y", 0, 1)),
    ];

    private static readonly double[][] Diagonal = [[0.1, 0.1], [0.3, 0.3], [0.5, 0.5], [0.7, 0.7], [0.9, 0.9]];

    [Fact]
    public void Integrates_to_one_over_the_space()
    {
        // Given kernels near the edges, which truncation must renormalise
        var density = ProductKernelDensity.Fit(Square, [[0.02, 0.5], [0.5, 0.98], [0.6, 0.6]], wideKernelWeight: 1);

        // When the density is summed on a 400 × 400 midpoint grid
        const int n = 400;
        double sum = 0;
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                sum += Math.Exp(density.LogDensity([(i + 0.5) / n, (j + 0.5) / n]));
            }
        }

        // Then the mass is one
        Assert.Equal(1.0, sum / (n * n), 3);
    }

    [Fact]
    public void Keeps_which_values_came_together_where_independent_densities_cannot()
    {
        // Given points on the diagonal x = y: every x and every y alone is equally common
        var joint = ProductKernelDensity.Fit(Square, Diagonal, wideKernelWeight: 1);
        var independent = IndependentDensity.Fit(Square, Diagonal, wideKernelWeight: 1);

        // Then the joint density is far higher on the diagonal than off it, and the independent one is not
        double jointGap = joint.LogDensity([0.1, 0.1]) - joint.LogDensity([0.1, 0.9]);
        double independentGap = independent.LogDensity([0.1, 0.1]) - independent.LogDensity([0.1, 0.9]);
        Assert.True(jointGap > Math.Log(10), $"joint log gap {jointGap}");
        Assert.Equal(0, independentGap, 9);
    }

    [Fact]
    public void Draws_a_choice_as_often_as_its_density_says()
    {
        // Given four points that all took choice 1 of three, and the uniform prior kernel
        TpeDimension[] kind = [new(0, ParameterRange.OneOf("kind", "a", "b", "c"))];
        var density = ProductKernelDensity.Fit(kind, [[1], [1], [1], [1]], wideKernelWeight: 1);

        // When it draws 20,000 times
        var random = new Random(5);
        var draw = new double[1];
        int ones = 0;
        for (int i = 0; i < 20_000; i++)
        {
            density.Sample(random, draw);
            ones += draw[0] == 1 ? 1 : 0;
        }

        // Then the share of ones matches both the density and the hand-worked mixture:
        // 4/5 · (0.75 + 0.25/3) + 1/5 · 1/3 = 0.73333
        double expected = (0.8 * (ProductKernelDensity.ChoiceKeep + ((1 - ProductKernelDensity.ChoiceKeep) / 3))) + (0.2 / 3);
        Assert.Equal(0.733333, expected, 5);
        Assert.Equal(expected, Math.Exp(density.LogDensity([1])), 9);
        Assert.Equal(expected, ones / 20_000.0, 2);
    }

    [Fact]
    public void Draws_whole_numbers_for_integer_parameters_and_stays_inside_the_space()
    {
        TpeDimension[] dims = [new(0, ParameterRange.Whole("leaves", 8, 128)), new(1, ParameterRange.Log("rate", 0.01, 0.3))];
        var density = ProductKernelDensity.Fit(dims, [[8, Math.Log(0.01)], [128, Math.Log(0.3)], [40, Math.Log(0.05)]], wideKernelWeight: 1);
        var random = new Random(2);
        var draw = new double[2];
        for (int i = 0; i < 2_000; i++)
        {
            density.Sample(random, draw);
            Assert.Equal(Math.Round(draw[0]), draw[0]);
            Assert.InRange(draw[0], 8, 128);
            Assert.InRange(draw[1], Math.Log(0.01), Math.Log(0.3));
        }
    }
}
