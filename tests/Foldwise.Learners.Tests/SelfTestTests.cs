using Foldwise.Core.Learning;

namespace Foldwise.Learners.Tests;

/// <summary>The worker's self-test on the real learners: each built-in family trains its tiny model on this machine.</summary>
public sealed class SelfTestTests
{
    [Fact]
    public void Every_built_in_family_passes_the_self_test_here()
    {
        foreach (string family in LearnerCatalog.BuiltIn.Families)
        {
            Assert.Null(LearnerSelfTest.Problem(LearnerCatalog.BuiltIn.Get(family)));
        }
    }

    [Fact]
    public void This_machine_has_the_native_prerequisites()
    {
        Assert.Empty(NativePrerequisites.Missing());
    }
}
