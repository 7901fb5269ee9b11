using System.Security.Cryptography;
using Foldwise.Core.Data;

namespace Foldwise.Tuning;

/// <summary>The screened tables' encodings kept beside the store (OUT/tables/HASH.fwt), so resume needs no CSV.</summary>
public static class TableFiles
{
    public static string PathOf(string outDir, string hash) => Path.Combine(outDir, "tables", hash + ".fwt");

    /// <summary>Writes through a partial file and a rename, so a kill mid-write never leaves a truncated table under its hash.</summary>
    public static void Write(string outDir, string hash, byte[] bytes)
    {
        string path = PathOf(outDir, hash);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        string partial = path + ".part";
        using (var stream = new FileStream(partial, FileMode.Create, FileAccess.Write, FileShare.None))
        {
            stream.Write(bytes);
            stream.Flush(flushToDisk: true);
        }

        File.Move(partial, path, overwrite: true);
    }

    /// <summary>
    /// Reads a stored table back and checks it is the one the search was screened into (same SHA-256);
    /// a missing or altered file fails with its path and how to recover.
    /// </summary>
    public static (FeatureTable Table, byte[] Bytes) Read(string outDir, string hash, string role)
    {
        string path = PathOf(outDir, hash);
        if (!File.Exists(path))
        {
            throw new InputException(
                path,
                $"the search's screened {role} table is missing. Copy it back from a backup of this folder, " +
                "or start the search again from its CSV files with 'foldwise run' into a new --out folder");
        }

        byte[] bytes = File.ReadAllBytes(path);
        string actual = Convert.ToHexStringLower(SHA256.HashData(bytes));
        if (!string.Equals(actual, hash, StringComparison.Ordinal))
        {
            throw new InputException(
                path,
                $"the screened {role} table was altered (its SHA-256 is {actual}, the search expects {hash}). " +
                "Restore the original file, or start the search again with 'foldwise run' into a new --out folder");
        }

        return (TableCodec.Decode(bytes, path), bytes);
    }
}
