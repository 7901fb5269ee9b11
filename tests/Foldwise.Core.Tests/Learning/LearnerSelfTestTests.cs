using Foldwise.Core.Definition;
using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Testing.Fakes;

namespace Foldwise.Core.Tests.Learning;

public sealed class LearnerSelfTestTests
{
    [Fact]
    public void A_learner_that_fits_passes()
    {
        Assert.Null(LearnerSelfTest.Problem(new MeanLearner("mean")));
    }

    [Fact]
    public void A_learner_whose_native_library_is_missing_fails_with_the_innermost_reason()
    {
        var broken = new MeanLearner("mean")
        {
            Broken = new TypeInitializationException("Native", new DllNotFoundException("Unable to load shared library 'lib_lightgbm'")),
        };

        Assert.Equal("DllNotFoundException: Unable to load shared library 'lib_lightgbm'", LearnerSelfTest.Problem(broken));
    }

    [Fact]
    public void Built_in_families_are_tested_with_valid_parameters_and_leaf_sizes_the_tiny_folds_allow()
    {
        foreach (string family in FamilyNames.All)
        {
            var parameters = LearnerSelfTest.ParametersFor(family);
            var space = DefaultSpaces.For(family);
            if (space.Find(LeafSizeFit.Parameter) is { } leaves)
            {
                // Two tiny folds of 20 training rows each: a quarter of that, 5, is the most a leaf may need.
                Assert.InRange(parameters[LeafSizeFit.Parameter], leaves.Low, LeafSizeFit.Cap(20));
                parameters = parameters with { Values = parameters.Values.SetItem(LeafSizeFit.Parameter, leaves.Low) };
            }

            Assert.Empty(space.Problems(parameters));
        }
    }
}
