namespace Foldwise.Storage;

/// <summary>
/// A search store could not be opened, read or written; the message names the file and says what to do.
/// </summary>
public sealed class StoreException : Exception
{
    public StoreException()
    {
    }

    public StoreException(string message)
        : base(message)
    {
    }

    public StoreException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
