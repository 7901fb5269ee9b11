using Foldwise.Core.Search;

namespace Foldwise.Core.Tests;

public sealed class CoreIsPureTests
{
    [Fact]
    public void Core_references_nothing_but_the_base_class_library()
    {
        var references = typeof(SearchCoordinator).Assembly.GetReferencedAssemblies().Select(a => a.Name!).ToList();

        Assert.DoesNotContain(references, n => n.StartsWith("Orleans", StringComparison.Ordinal) || n.StartsWith("Microsoft.Orleans", StringComparison.Ordinal));
        Assert.DoesNotContain(references, n => n.StartsWith("LiteDB", StringComparison.Ordinal));
        Assert.DoesNotContain(references, n => n.StartsWith("Microsoft.ML", StringComparison.Ordinal));
        Assert.All(references, n => Assert.True(n.StartsWith("System", StringComparison.Ordinal) || n == "netstandard", $"{n} is not part of the BCL"));
    }
}
