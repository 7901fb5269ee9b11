using System.Runtime.InteropServices;

namespace Foldwise.Cli.Running;

/// <summary>
/// Replaces this process with a fresh run of the same command line (execve: same PID, terminal and service
/// supervision). A worker starts over this way after a failed join or a lost cluster: a silo that failed to
/// join was seen to leave busy threads behind in the process (2 cores at 100 % for as long as it kept
/// retrying), and a new process carries nothing over. Linux and macOS only; elsewhere it does nothing.
/// </summary>
public static class FreshProcess
{
    /// <summary>Set in the fresh process: how many attempts came before it (so its lines keep counting).</summary>
    public const string AttemptVariable = "FOLDWISE_JOIN_ATTEMPT";

    /// <summary>Returns only when the exec failed (or on Windows); the caller then starts over in-process.</summary>
    public static void Restart(string[] args, int attemptsSoFar)
    {
        if (OperatingSystem.IsWindows() || Environment.ProcessPath is not { } executable)
        {
            return;
        }

        string?[] argv = [executable, .. OwnCommand.Arguments(args), null];
        var environment = Environment.GetEnvironmentVariables().Cast<System.Collections.DictionaryEntry>()
            .Where(e => (string)e.Key != AttemptVariable)
            .Select(e => $"{e.Key}={e.Value}")
            .Append($"{AttemptVariable}={attemptsSoFar}")
            .Cast<string?>()
            .Append(null);
        Console.Out.Flush();
        Console.Error.Flush();
        try
        {
            _ = Exec(executable, argv, [.. environment]);
        }
        catch (Exception e) when (e is MarshalDirectiveException or DllNotFoundException or EntryPointNotFoundException)
        {
            // No execve here: start over in-process.
        }
    }

    [DllImport("libc", EntryPoint = "execve", SetLastError = true)]
    [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
#pragma warning disable SYSLIB1054, CA2101 // one plain call; LPStr is UTF-8 on Unix
    private static extern int Exec([MarshalAs(UnmanagedType.LPUTF8Str)] string path, [MarshalAs(UnmanagedType.LPArray, ArraySubType = UnmanagedType.LPStr)] string?[] argv,
        [MarshalAs(UnmanagedType.LPArray, ArraySubType = UnmanagedType.LPStr)] string?[] envp);
#pragma warning restore SYSLIB1054, CA2101
}
