using System.Collections.Immutable;
using Foldwise.Core.Blending;
using Foldwise.Core.Definition;

namespace Foldwise.Core.Tests.Blending;

public sealed class DiversityTests
{
    [Fact]
    public void Correlations_are_one_on_the_diagonal_symmetric_and_signed()
    {
        // Given a vector, a rescaled copy, its mirror and one unrelated to it (worked by hand: Σxy = 0)
        double[] a = [1, 2, 3, 4];
        double[] scaled = [10, 30, 50, 70];
        double[] mirror = [4, 3, 2, 1];
        double[] unrelated = [1, -1, -1, 1];

        var r = OutOfFoldCorrelations.Of([a, scaled, mirror, unrelated]);

        Assert.Equal(1, r[0, 0], 12);
        Assert.Equal(1, r[0, 1], 12);
        Assert.Equal(-1, r[0, 2], 12);
        Assert.Equal(0, r[0, 3], 12);
        Assert.Equal(r[2, 1], r[1, 2]);
    }

    [Fact]
    public void A_constant_vector_has_no_correlation()
    {
        var r = OutOfFoldCorrelations.Of([[1, 2, 3], [5, 5, 5]]);

        Assert.True(double.IsNaN(r[0, 1]));
        Assert.True(double.IsNaN(r[1, 1]));
    }

    [Fact]
    public void Family_weights_sum_each_familys_members_heaviest_first_and_name_families_without_weight()
    {
        var blend = new BlendSummary(BlendMode.Simplex,
            [new BlendMember(1, "lightgbm", 0.5), new BlendMember(2, "linear", 0.3), new BlendMember(3, "lightgbm", 0.2), new BlendMember(4, "forest", 0)],
            0.1, 0.1, ImmutableArray<double>.Empty, 1, 0.1);

        var weights = FamilyWeights.Of(blend, ["fasttree", "lightgbm", "forest", "linear"]);

        Assert.Equal([("lightgbm", 0.7), ("linear", 0.3), ("fasttree", 0.0), ("forest", 0.0)], weights.Select(w => (w.Family, Math.Round(w.Weight, 12))));
    }
}
