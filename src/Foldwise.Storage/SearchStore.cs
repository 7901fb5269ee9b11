using Foldwise.Core.Search;
using LiteDB;

namespace Foldwise.Storage;

/// <summary>
/// The LiteDB file of one search (<c>OUT/search.db</c>): header, trials, prediction vectors, screening report
/// and blend. One process writes it (the coordinator, through <see cref="Create"/> or <see cref="Open"/>);
/// any number read it meanwhile through <see cref="OpenReadOnly"/>. Every instance uses LiteDB's shared mode,
/// which opens the file and takes a named mutex for each call and closes it after (flushed to disk and
/// checkpointed), so a reader's call holds the writer up only for its own duration and a call that returned is durable.
/// One instance may be used from several threads; its calls run one at a time.
/// </summary>
public sealed partial class SearchStore : ISearchRecorder, IDisposable
{
    private readonly LiteDatabase _db;
    private readonly WriterLock? _writerLock;

    // LiteDB's shared mode keeps its named mutex per thread of the instance and counts nested calls:
    // two threads in one instance at once would release a mutex the other acquired. Calls are serialised here.
    private readonly Lock _gate = new();
    private bool _disposed;

    private SearchStore(string path, LiteDatabase db, WriterLock? writerLock, string writtenBy)
    {
        FilePath = path;
        _db = db;
        _writerLock = writerLock;
        WrittenBy = writtenBy;
    }

    /// <summary>The store's full path.</summary>
    public string FilePath { get; }

    /// <summary>True for an instance from <see cref="OpenReadOnly"/>; its writes throw.</summary>
    public bool IsReadOnly => _writerLock is null;

    /// <summary>The tool that created the file, e.g. <c>Foldwise 1.0.0</c>.</summary>
    public string WrittenBy { get; }

    /// <summary>Creates a new store, for a new search; fails if the file exists.</summary>
    public static SearchStore Create(string path)
    {
        string full = Path.GetFullPath(path);
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        var writerLock = WriterLock.Acquire(full);
        LiteDatabase? db = null;
        try
        {
            if (File.Exists(full))
            {
                throw new StoreException(
                    $"{full} already exists: that directory holds a search already. Resume it, or choose another output directory.");
            }

            // The format record is written under a temporary name and the file renamed into place, so a kill
            // mid-creation never leaves a search.db without its format record (which no command could open again).
            string partial = full + ".new";
            File.Delete(partial);
            using (var creating = Connect(partial, readOnly: false))
            {
                StoreFormat.Write(creating);
            }

            File.Move(partial, full);
            db = Connect(full, readOnly: false);
            return new SearchStore(full, db, writerLock, StoreFormat.ToolVersion);
        }
        catch (Exception ex) when (ex is not StoreException)
        {
            db?.Dispose();
            writerLock.Dispose();
            throw new StoreException($"{full} could not be created: {ex.Message}", ex);
        }
        catch
        {
            db?.Dispose();
            writerLock.Dispose();
            throw;
        }
    }

    /// <summary>Opens an existing store for writing, to resume its search; fails while another process writes it.</summary>
    public static SearchStore Open(string path) => OpenExisting(path, readOnly: false);

    /// <summary>Opens an existing store for reading; works while the coordinator writes it, and sees its later saves.</summary>
    public static SearchStore OpenReadOnly(string path) => OpenExisting(path, readOnly: true);

    public void Dispose()
    {
        lock (_gate)
        {
            if (_disposed)
            {
                return;
            }

            _disposed = true;
            _db.Dispose();
            _writerLock?.Dispose();
        }
    }

    private static SearchStore OpenExisting(string path, bool readOnly)
    {
        string full = Path.GetFullPath(path);
        if (!File.Exists(full))
        {
            throw new StoreException($"There is no search store at {full}.");
        }

        StoreFormat.EnsureLiteDbFile(full);
        var writerLock = readOnly ? null : WriterLock.Acquire(full);
        LiteDatabase? db = null;
        try
        {
            db = Connect(full, readOnly);
            string writtenBy = StoreFormat.Check(db, full);
            if (!readOnly)
            {
                StoreFormat.Upgrade(db);
            }

            return new SearchStore(full, db, writerLock, writtenBy);
        }
        catch (Exception ex) when (ex is not StoreException)
        {
            db?.Dispose();
            writerLock?.Dispose();
            throw new StoreException($"{full} could not be opened: {ex.Message}", ex);
        }
        catch
        {
            db?.Dispose();
            writerLock?.Dispose();
            throw;
        }
    }

    // Shared mode everywhere: Connection=direct takes no lock between processes on Linux (in a probe, two direct
    // writers silently lost half their inserts), so a direct reader could read pages mid-write. The full path keeps every process on the same mutex name.
    private static LiteDatabase Connect(string fullPath, bool readOnly) => new(new ConnectionString
    {
        Filename = fullPath,
        Connection = ConnectionType.Shared,
        ReadOnly = readOnly,
    });

    private T Read<T>(Func<LiteDatabase, T> action)
    {
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            try
            {
                return action(_db);
            }
            catch (LiteException ex)
            {
                throw new StoreException($"{FilePath} could not be read: {ex.Message}", ex);
            }
        }
    }

    private void Write(Action<LiteDatabase> action)
    {
        lock (_gate)
        {
            ObjectDisposedException.ThrowIf(_disposed, this);
            if (IsReadOnly)
            {
                throw new StoreException($"{FilePath} was opened read-only; only the search's coordinator writes it.");
            }

            try
            {
                action(_db);
            }
            catch (LiteException ex)
            {
                throw new StoreException($"{FilePath} could not be written: {ex.Message}", ex);
            }
        }
    }
}
