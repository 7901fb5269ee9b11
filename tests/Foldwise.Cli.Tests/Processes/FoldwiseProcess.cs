using System.Globalization;
using System.Collections.Concurrent;
using System.Diagnostics;

namespace Foldwise.Cli.Tests.Processes;

/// <summary>
/// <c>foldwise</c> as a real child process (the built foldwise.dll beside the tests), for tests that kill
/// and restart processes. Collects stdout and stderr lines as they come; <see cref="Kill"/> is SIGKILL.
/// </summary>
public sealed class FoldwiseProcess : IDisposable
{
    private readonly Process process;
    private readonly ConcurrentQueue<string> lines = new();
    private readonly SemaphoreSlim arrived = new(0);

    private FoldwiseProcess(Process process)
    {
        this.process = process;
        process.OutputDataReceived += (_, e) => Add(e.Data);
        process.ErrorDataReceived += (_, e) => Add(e.Data);
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
    }

    public int Id => process.Id;

    public bool HasExited => process.HasExited;

    public IReadOnlyList<string> Lines => [.. lines];

    public string Output => string.Join('\n', lines);

    public static FoldwiseProcess Start(params string[] args)
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "foldwise.dll");
        var info = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(dll);
        foreach (string arg in args)
        {
            info.ArgumentList.Add(arg);
        }

        info.Environment["DOTNET_NOLOGO"] = "1";
        return new FoldwiseProcess(Process.Start(info) ?? throw new InvalidOperationException("could not start foldwise"));
    }

    /// <summary>
    /// <c>foldwise</c> whose files may grow to <paramref name="kilobytes"/> KiB at most (<c>ulimit -f</c>): a write beyond
    /// fails as on a full disk (the shell ignores SIGXFSZ, so the write returns an error instead of ending the process).
    /// </summary>
    public static FoldwiseProcess StartWithFileSizeLimit(int kilobytes, params string[] args)
    {
        string dll = Path.Combine(AppContext.BaseDirectory, "foldwise.dll");
        var info = new ProcessStartInfo("bash")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            RedirectStandardInput = true,
            UseShellExecute = false,
        };
        foreach (string arg in (string[])["-c", "trap '' XFSZ; ulimit -f \"$1\"; shift; exec \"$@\"", "bash", kilobytes.ToString(CultureInfo.InvariantCulture), "dotnet", dll, .. args])
        {
            info.ArgumentList.Add(arg);
        }

        info.Environment["DOTNET_NOLOGO"] = "1";
        // The runtime maps its generated code through a file that grows past a small limit (measured: a segfault at
        // start under 120 KiB); without write-xor-execute it does not.
        info.Environment["DOTNET_EnableWriteXorExecute"] = "0";
        return new FoldwiseProcess(Process.Start(info) ?? throw new InvalidOperationException("could not start foldwise"));
    }

    /// <summary>Waits until a line matching <paramref name="match"/> has been printed; false on timeout or exit.</summary>
    public async Task<bool> WaitForLineAsync(Func<string, bool> match, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (DateTime.UtcNow < deadline)
        {
            if (lines.Any(match))
            {
                return true;
            }

            if (process.HasExited && !await arrived.WaitAsync(200))
            {
                return lines.Any(match);
            }

            await arrived.WaitAsync(TimeSpan.FromMilliseconds(200));
        }

        return lines.Any(match);
    }

    /// <summary>Waits for exit and returns the exit code; kills the process and throws on timeout.</summary>
    public async Task<int> WaitForExitAsync(TimeSpan timeout)
    {
        using var cancel = new CancellationTokenSource(timeout);
        try
        {
            await process.WaitForExitAsync(cancel.Token);
        }
        catch (OperationCanceledException)
        {
            Kill();
            throw new TimeoutException($"foldwise did not exit within {timeout}; output:\n{Output}");
        }

        process.WaitForExit(); // drains the output readers
        return process.ExitCode;
    }

    /// <summary>SIGKILL: no chance to clean up, as when a machine loses power or a user kills -9.</summary>
    public void Kill()
    {
        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: true);
            process.WaitForExit();
        }
    }

    /// <summary>SIGKILL to the launched process only, as <c>kill -9 PID</c> does: any child it started is left running.</summary>
    public void KillLaunchedOnly()
    {
        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: false);
            process.WaitForExit();
        }
    }

    /// <summary>Processes other than this test run whose command line mentions <paramref name="text"/> (Linux: /proc).</summary>
    public static IReadOnlyList<int> ProcessesMentioning(string text) =>
    [
        .. Directory.EnumerateDirectories("/proc")
            .Select(d => (Pid: int.TryParse(Path.GetFileName(d), out int pid) ? pid : 0, Directory: d))
            .Where(p => p.Pid > 0 && p.Pid != Environment.ProcessId && CommandLine(p.Directory).Contains(text, StringComparison.Ordinal))
            .Select(p => p.Pid),
    ];

    public void Dispose()
    {
        Kill();
        process.Dispose();
        arrived.Dispose();
    }

    private static string CommandLine(string procDirectory)
    {
        try
        {
            return File.ReadAllText(Path.Combine(procDirectory, "cmdline")).Replace('\0', ' ');
        }
        catch (IOException)
        {
            return "";
        }
        catch (UnauthorizedAccessException)
        {
            return "";
        }
    }

    private void Add(string? line)
    {
        if (line is not null)
        {
            lines.Enqueue(line);
            arrived.Release();
        }
    }
}
