namespace Foldwise.Storage;

/// <summary>
/// Keeps a second coordinator off a store: the writing instance holds <c>search.db.lock</c> open with
/// <see cref="FileShare.None"/>, which .NET enforces between processes on Linux with an advisory lock that
/// the kernel drops when the process dies, so a killed coordinator never leaves the search locked.
/// The file itself is left in place: deleting a lock file others may be opening would let two holders in.
/// </summary>
internal sealed class WriterLock : IDisposable
{
    private readonly FileStream _stream;

    private WriterLock(FileStream stream) => _stream = stream;

    public static string PathFor(string storePath) => storePath + ".lock";

    public static WriterLock Acquire(string storePath)
    {
        string lockPath = PathFor(storePath);
        try
        {
            return new WriterLock(new FileStream(lockPath, FileMode.OpenOrCreate, FileAccess.ReadWrite, FileShare.None));
        }
        catch (IOException ex) when (ex is not FileNotFoundException and not DirectoryNotFoundException)
        {
            throw new StoreBusyException(
                $"Another process is writing {storePath} (it holds {lockPath}). " +
                "Only one coordinator may run a search; stop it first, or use a read-only command.", ex);
        }
    }

    public void Dispose() => _stream.Dispose();
}
