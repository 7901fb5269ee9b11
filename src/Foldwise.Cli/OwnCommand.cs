namespace Foldwise.Cli;

/// <summary>How to run this foldwise again with other arguments: through the app host, or `dotnet foldwise.dll`.</summary>
internal static class OwnCommand
{
    public static string Executable => Environment.ProcessPath ?? throw new InvalidOperationException("the path of this foldwise is unknown");

    /// <summary>
    /// The arguments after <see cref="Executable"/>: the dll first when the executable is the dotnet host (found beside the
    /// program, since a single-file build has no assembly locations).
    /// </summary>
    public static IEnumerable<string> Arguments(IEnumerable<string> args) =>
        Path.GetFileNameWithoutExtension(Executable) == "dotnet" ? args.Prepend(Path.Combine(AppContext.BaseDirectory, typeof(OwnCommand).Assembly.GetName().Name + ".dll")) : args;
}
