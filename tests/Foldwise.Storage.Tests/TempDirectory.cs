namespace Foldwise.Storage.Tests;

/// <summary>A fresh directory under the system temp path, deleted with everything in it on dispose.</summary>
internal sealed class TempDirectory : IDisposable
{
    public TempDirectory() => Directory.CreateDirectory(Path);

    public string Path { get; } = System.IO.Path.Combine(System.IO.Path.GetTempPath(), "foldwise-store-" + Guid.NewGuid().ToString("N"));

    public string StorePath => StoreFile.PathIn(Path);

    public void Dispose()
    {
        try
        {
            Directory.Delete(Path, recursive: true);
        }
        catch (IOException)
        {
            // A killed child may still be closing its handles; the directory is in temp, so leaving it is harmless.
        }
    }
}
