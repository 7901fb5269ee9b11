using System.Security.Cryptography;
using Foldwise.Core.Data;

namespace Foldwise.Tuning;

/// <summary>The screened tables' encodings kept beside the store (OUT/tables/HASH.fwt), so resume needs no CSV.</summary>
public static class TableFiles
{
    public static string PathOf(string outDir, string hash) => Path.Combine(outDir, "tables", hash + ".fwt");

    /// <summary>
    /// Encodes the table straight into a partial file, hashing as it writes, and renames it to its hash, so a kill
    /// mid-write never leaves a truncated table under its hash and the encoding is never one array. Returns the hash.
    /// </summary>
    /// <param name="bytesWritten">Told the bytes written so far as the encoding goes (its length is not known before).</param>
    public static string Write(string outDir, FeatureTable table, Action<long, long>? bytesWritten = null)
    {
        string folder = Path.Combine(outDir, "tables");
        Directory.CreateDirectory(folder);
        string partial = Path.Combine(folder, "encoding." + Environment.ProcessId + ".part");
        string hash;
        using (var file = new FileStream(partial, FileMode.Create, FileAccess.Write, FileShare.None, bufferSize: 1))
        {
            using (var counted = new CountingStream(file, bytesWritten))
            {
                hash = TableCodec.Encode(table, counted);
            }

            file.Flush(flushToDisk: true);
        }

        File.Move(partial, PathOf(outDir, hash), overwrite: true);
        return hash;
    }

    /// <summary>
    /// Reads a stored table back and checks it is the one the search was screened into (same SHA-256);
    /// a missing or altered file fails with its path and how to recover.
    /// </summary>
    public static FeatureTable Read(string outDir, string hash, string role)
    {
        string path = PathOf(outDir, hash);
        if (!File.Exists(path))
        {
            throw new InputException(
                path,
                $"the search's screened {role} table is missing. Copy it back from a backup of this folder, " +
                "or start the search again from its CSV files with 'foldwise run' into a new --out folder");
        }

        using var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, bufferSize: 1 << 16);
        string actual = Convert.ToHexStringLower(SHA256.HashData(file));
        if (!string.Equals(actual, hash, StringComparison.Ordinal))
        {
            throw new InputException(
                path,
                $"the screened {role} table was altered (its SHA-256 is {actual}, the search expects {hash}). " +
                "Restore the original file, or start the search again with 'foldwise run' into a new --out folder");
        }

        file.Position = 0;
        return TableCodec.Decode(file, path);
    }
}
