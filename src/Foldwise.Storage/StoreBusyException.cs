namespace Foldwise.Storage;

/// <summary>Another process holds the store's writer lock: a coordinator is running that search already.</summary>
public sealed class StoreBusyException : Exception
{
    public StoreBusyException()
    {
    }

    public StoreBusyException(string message)
        : base(message)
    {
    }

    public StoreBusyException(string message, Exception innerException)
        : base(message, innerException)
    {
    }
}
