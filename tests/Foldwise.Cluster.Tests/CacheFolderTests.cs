using Foldwise.Cluster.Workers;

namespace Foldwise.Cluster.Tests;

/// <summary>Cached tables are their owner's only and kept under a size cap, least recently used first.</summary>
public sealed class CacheFolderTests : IDisposable
{
    private readonly string folder = Path.Combine(Path.GetTempPath(), "foldwise-cache-tests", Guid.NewGuid().ToString("N"), "tables");

    public void Dispose() => Directory.Delete(Path.GetDirectoryName(folder)!, recursive: true);

    [Fact]
    public async Task The_folder_and_its_tables_are_readable_by_their_owner_only()
    {
        if (OperatingSystem.IsWindows())
        {
            return; // Unix permissions; Windows keeps a user's profile folder private already.
        }

        CacheFolder.Ensure(folder);
        string table = Path.Combine(folder, "a" + CacheFolder.Extension);

        await WriteAsync(table, [1, 2, 3]);

        Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute, File.GetUnixFileMode(folder));
        Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(table));
    }

    [Fact]
    public async Task Pruning_deletes_the_least_recently_used_tables_until_the_cap_holds()
    {
        // Given three 100-byte tables used in the order old, middle, new
        CacheFolder.Ensure(folder);
        string[] names = ["old", "middle", "new"];
        for (int i = 0; i < names.Length; i++)
        {
            string path = Path.Combine(folder, names[i] + CacheFolder.Extension);
            await WriteAsync(path, new byte[100]);
            File.SetLastWriteTimeUtc(path, new DateTime(2026, 12, 1, 9, i, 0, DateTimeKind.Utc));
        }

        // When the cap is 250 bytes
        int deleted = CacheFolder.Prune(folder, 250);

        // Then only the least recently used one went
        Assert.Equal(1, deleted);
        Assert.Equal(["middle.fwt", "new.fwt"], Directory.GetFiles(folder).Select(Path.GetFileName).Order());
        Assert.Equal(2, CacheFolder.Clear(folder));
        Assert.Empty(Directory.GetFiles(folder));
    }

    private static async Task WriteAsync(string path, byte[] bytes)
    {
        await using var file = CacheFolder.CreateOwnerOnly(path);
        await file.WriteAsync(bytes);
    }
}
