namespace Foldwise.Cli;

/// <summary>What <c>foldwise</c> exits with.</summary>
public static class ExitCodes
{
    public const int Ok = 0;

    /// <summary>The user's files or flags are wrong; the message names the file, line and column.</summary>
    public const int BadInput = 1;

    /// <summary>The search could not run to the end (a fault, not the input).</summary>
    public const int Failed = 3;

    /// <summary>Stopped by the user before the blend (second Ctrl-C).</summary>
    public const int Interrupted = 130;
}
