using System.Collections.Immutable;
using System.Security.Cryptography;
using Foldwise.Core.Data;
using Foldwise.Core.Search;

namespace Foldwise.Tuning;

/// <summary>
/// One kept blend member's fold models in one file beside the store (OUT/models/SHA256.fwm): a format line, the
/// search id, the trial id, its family and its fold models in fold order, each length-prefixed. The file is named by
/// the SHA-256 of its content, which the store records, so a file of another search or an altered one is refused.
/// </summary>
public static class KeptModelFiles
{
    public const string FolderName = "models";

    private const string Format = "foldwise-kept-models 1";

    public static string FolderIn(string outDir) => Path.Combine(outDir, FolderName);

    public static string PathOf(string outDir, string hash) => Path.Combine(FolderIn(outDir), hash + ".fwm");

    /// <summary>Writes the member's models under a partial name, then renames the file to its hash; returns (hash, bytes).</summary>
    public static (string Hash, long Bytes) Write(string outDir, string searchId, int trialId, string family, IReadOnlyList<byte[]> folds)
    {
        ArgumentNullException.ThrowIfNull(folds);
        Directory.CreateDirectory(FolderIn(outDir));
        string partial = Path.Combine(FolderIn(outDir), $"models.{Environment.ProcessId}.part");
        string hash;
        long bytes;
        using (var file = new FileStream(partial, FileMode.Create, FileAccess.ReadWrite, FileShare.None, 1 << 16))
        {
            using (var writer = new BinaryWriter(file, System.Text.Encoding.UTF8, leaveOpen: true))
            {
                writer.Write(Format);
                writer.Write(searchId);
                writer.Write(trialId);
                writer.Write(family);
                writer.Write(folds.Count);
                foreach (var model in folds)
                {
                    writer.Write(model.Length);
                    writer.Write(model);
                }
            }

            file.Flush(flushToDisk: true);
            bytes = file.Length;
            file.Position = 0;
            hash = Convert.ToHexStringLower(SHA256.HashData(file));
        }

        File.Move(partial, PathOf(outDir, hash), overwrite: true);
        return (hash, bytes);
    }

    /// <summary>True when the member's file is present with the content the store recorded.</summary>
    public static bool Holds(string outDir, KeptMember member)
    {
        ArgumentNullException.ThrowIfNull(member);
        string path = PathOf(outDir, member.Hash);
        if (!File.Exists(path))
        {
            return false;
        }

        using var file = File.OpenRead(path);
        return string.Equals(Convert.ToHexStringLower(SHA256.HashData(file)), member.Hash, StringComparison.Ordinal);
    }

    /// <summary>
    /// The member's fold models, after checking the file is the one the store recorded for this search; a missing,
    /// altered or foreign file is an <see cref="InputException"/> naming it and what to do.
    /// </summary>
    public static ImmutableArray<byte[]> Read(string outDir, string searchId, KeptMember member)
    {
        ArgumentNullException.ThrowIfNull(member);
        string path = PathOf(outDir, member.Hash);
        if (!File.Exists(path))
        {
            throw new InputException(
                path,
                $"trial {member.TrialId}'s kept models are missing: the models folder is not this search's ({searchId}) or was not copied with the store. " +
                "Copy the search's whole folder, or run 'foldwise blend STORE' to re-fit and keep them");
        }

        byte[] content = File.ReadAllBytes(path);
        string actual = Convert.ToHexStringLower(SHA256.HashData(content));
        if (!string.Equals(actual, member.Hash, StringComparison.Ordinal))
        {
            throw new InputException(
                path,
                $"the kept models' SHA-256 is {actual} but the store expects {member.Hash}: the file was altered or belongs to another search. " +
                "Restore it, or run 'foldwise blend STORE' to re-fit and keep the blend's members");
        }

        using var reader = new BinaryReader(new MemoryStream(content, writable: false), System.Text.Encoding.UTF8);
        string format = reader.ReadString();
        string search = reader.ReadString();
        int trial = reader.ReadInt32();
        string family = reader.ReadString();
        if (format != Format || search != searchId || trial != member.TrialId || family != member.Family)
        {
            throw new InputException(path, $"holds trial {trial} ({family}) of search {search}, not trial {member.TrialId} ({member.Family}) of search {searchId}");
        }

        int count = reader.ReadInt32();
        var folds = ImmutableArray.CreateBuilder<byte[]>(count);
        for (int f = 0; f < count; f++)
        {
            folds.Add(reader.ReadBytes(reader.ReadInt32()));
        }

        return folds.MoveToImmutable();
    }
}
