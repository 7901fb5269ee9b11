namespace Foldwise.Storage;

/// <summary>Where a search keeps its store: <c>search.db</c> in the search's output directory.</summary>
public static class StoreFile
{
    /// <summary>The store's file name inside an output directory.</summary>
    public const string FileName = "search.db";

    /// <summary>The conventional store path for an output directory.</summary>
    public static string PathIn(string outDir) => Path.Combine(outDir, FileName);

    /// <summary>True when the output directory already holds a store file (which may belong to a finished search).</summary>
    public static bool ExistsIn(string outDir) => File.Exists(PathIn(outDir));

    /// <summary>A store path as the user gave it: the file itself, or the search's folder holding it.</summary>
    public static string Resolve(string fileOrFolder) =>
        Directory.Exists(fileOrFolder) ? PathIn(fileOrFolder) : fileOrFolder;
}
