namespace Foldwise.Learners.Native;

/// <summary>
/// LightGBM refused a call. The message names what was asked (the input or the parameters) and then LightGBM's own
/// reason; it is an <see cref="InvalidOperationException"/>, so a slot fails the trial with that message.
/// </summary>
public sealed class LightGbmException : InvalidOperationException
{
    public LightGbmException()
    {
    }

    public LightGbmException(string message)
        : base(message)
    {
    }

    public LightGbmException(string message, Exception inner)
        : base(message, inner)
    {
    }
}
