namespace Foldwise.Cli.Running;

/// <summary>The screened tables' encodings kept beside the store (OUT/tables/HASH.fwt), so resume needs no CSV.</summary>
public static class TableFiles
{
    public static string PathOf(string outDir, string hash) => Path.Combine(outDir, "tables", hash + ".fwt");

    public static void Write(string outDir, string hash, byte[] bytes)
    {
        string path = PathOf(outDir, hash);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        string partial = path + ".part";
        File.WriteAllBytes(partial, bytes);
        File.Move(partial, path, overwrite: true);
    }
}
