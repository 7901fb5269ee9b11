using System.Reflection;

namespace Foldwise.Core;

/// <summary>
/// This build's version: the project version and the first 12 hex digits of the commit it was built from
/// ("0.1.0+1a2b3c4d5e6f"), as <c>foldwise --version</c> prints it and as machines compare it when a worker joins.
/// </summary>
public static class BuildVersion
{
    public static string Text { get; } = Read();

    private static string Read()
    {
        string version = typeof(BuildVersion).Assembly.GetCustomAttribute<AssemblyInformationalVersionAttribute>()?.InformationalVersion ?? "unknown";
        int plus = version.IndexOf('+', StringComparison.Ordinal);
        return plus >= 0 && version.Length > plus + 13 ? version[..(plus + 13)] : version;
    }
}
