namespace Foldwise.Testing;

/// <summary>
/// The test lanes: a class marked <c>[Trait(Lane.Key, Lane.Slow)]</c> starts processes or clusters, or trains whole
/// searches; the rest is the fast lane, <c>dotnet test Foldwise.slnx --filter "Lane!=Slow"</c>.
/// </summary>
public static class Lane
{
    public const string Key = "Lane";
    public const string Slow = "Slow";
}
