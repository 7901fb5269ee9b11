namespace Foldwise.Storage;

/// <summary>A store killed between its creation and its first record: no trial ever ran in it.</summary>
public static class UnstartedStore
{
    /// <summary>
    /// Deletes the store (and LiteDB's log file beside it) when it holds no search header, so a new search may
    /// start there. Returns false, and keeps the file, for anything else, including a file that is no store.
    /// </summary>
    public static bool Discard(string storePath)
    {
        try
        {
            using var store = SearchStore.Open(storePath);
            if (store.LoadHeader() is not null)
            {
                return false;
            }
        }
        catch (StoreException)
        {
            return false;
        }

        File.Delete(storePath);
        File.Delete(Path.Combine(Path.GetDirectoryName(storePath)!, Path.GetFileNameWithoutExtension(storePath) + "-log" + Path.GetExtension(storePath)));
        return true;
    }
}
