namespace Foldwise.Cluster.Workers;

/// <summary>
/// The worker's folder of fetched tables: readable by its owner only (folder 0700, files 0600 on Unix, since the
/// tables are the team's training data), and pruned to a size cap, least recently used first.
/// </summary>
public static class CacheFolder
{
    public const string Extension = ".fwt";

    private const UnixFileMode OwnerFolder = UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute;
    private const UnixFileMode OwnerFile = UnixFileMode.UserRead | UnixFileMode.UserWrite;

    /// <summary>Creates the folder (owner only), or narrows an existing one's permissions to its owner.</summary>
    public static void Ensure(string folder)
    {
        if (OperatingSystem.IsWindows())
        {
            Directory.CreateDirectory(folder);
            return;
        }

        Directory.CreateDirectory(folder, OwnerFolder);
        File.SetUnixFileMode(folder, OwnerFolder);
    }

    /// <summary>Creates (or empties) a file only its owner can read, open for writing.</summary>
    public static FileStream CreateOwnerOnly(string path)
    {
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write, Share = FileShare.None, BufferSize = 1 };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = OwnerFile;
        }

        return new FileStream(path, options);
    }

    /// <summary>Marks a cached table as just used, so pruning keeps it longest.</summary>
    public static void Touch(string path) => File.SetLastWriteTimeUtc(path, DateTime.UtcNow);

    /// <summary>Deletes the least recently used tables until the folder holds at most <paramref name="limitBytes"/>; returns how many went.</summary>
    public static int Prune(string folder, long limitBytes)
    {
        if (!Directory.Exists(folder))
        {
            return 0;
        }

        var files = new DirectoryInfo(folder).GetFiles("*" + Extension).OrderByDescending(f => f.LastWriteTimeUtc).ToList();
        long total = files.Sum(f => f.Length);
        int deleted = 0;
        for (int i = files.Count - 1; i >= 0 && total > limitBytes; i--)
        {
            total -= files[i].Length;
            files[i].Delete();
            deleted++;
        }

        return deleted;
    }

    /// <summary>Deletes every cached table; returns how many there were.</summary>
    public static int Clear(string folder) => Prune(folder, 0);
}
