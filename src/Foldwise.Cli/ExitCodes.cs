namespace Foldwise.Cli;

/// <summary>What <c>foldwise</c> exits with; the README's table of exit codes lists the same values.</summary>
public static class ExitCodes
{
    /// <summary>Done: the command did what it was asked.</summary>
    public const int Ok = 0;

    /// <summary>The user's files or definition are wrong; the message names the file, line and column.</summary>
    public const int BadInput = 1;

    /// <summary>The command line is wrong: an unknown command or option, a missing or invalid flag value.</summary>
    public const int Usage = 2;

    /// <summary>The search could not run to the end (a fault, not the input).</summary>
    public const int Failed = 3;

    /// <summary>Another process is writing the search's store (a coordinator runs it already).</summary>
    public const int StoreBusy = 4;

    /// <summary>
    /// This machine cannot work for the cluster: the coordinator runs another build, no family trains here, or the
    /// cluster's mutual TLS refuses it.
    /// </summary>
    public const int Refused = 5;

    /// <summary>Stopped by the user before the blend (second Ctrl-C or SIGTERM).</summary>
    public const int Interrupted = 130;
}
