namespace Foldwise.Core.Events;

/// <summary>A sink that drops every event: the default where nobody follows a search.</summary>
public sealed class NoEvents : IProgress<SearchEvent>
{
    public static NoEvents Instance { get; } = new();

    private NoEvents()
    {
    }

    public void Report(SearchEvent value)
    {
        // Nobody follows.
    }
}
