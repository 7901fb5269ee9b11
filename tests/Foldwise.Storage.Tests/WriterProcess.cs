using System.Collections.Concurrent;
using System.Diagnostics;
using System.Text;

namespace Foldwise.Storage.Tests;

/// <summary>
/// Runs the Writer project (copied beside the tests) as a child process: it saves trials in a loop and
/// prints <c>saved N</c> after each save returned.
/// </summary>
internal sealed class WriterProcess : IDisposable
{
    private readonly Process _process;
    private readonly StringBuilder _errors = new();
    private readonly BlockingCollection<string> _lines = [];

    private WriterProcess(Process process)
    {
        _process = process;
        _process.OutputDataReceived += (_, e) =>
        {
            if (e.Data is null)
            {
                _lines.CompleteAdding();
            }
            else
            {
                _lines.Add(e.Data);
            }
        };
        _process.ErrorDataReceived += (_, e) =>
        {
            lock (_errors)
            {
                _errors.AppendLine(e.Data);
            }
        };
        _process.BeginOutputReadLine();
        _process.BeginErrorReadLine();
    }

    /// <summary>The highest id the child printed as saved so far.</summary>
    public int Acknowledged { get; private set; }

    /// <summary>Every id the child printed as saved (its trial and vectors both stored), in order.</summary>
    public List<int> AcknowledgedIds { get; } = [];

    public static WriterProcess Loop(string storePath, string count, int outOfFoldLength, int testLength)
    {
        var info = new ProcessStartInfo(DotnetHost())
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            UseShellExecute = false,
        };
        info.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "Foldwise.Storage.Writer.dll"));
        foreach (string arg in new[] { "loop", storePath, count, outOfFoldLength.ToString(), testLength.ToString() })
        {
            info.ArgumentList.Add(arg);
        }

        return new WriterProcess(Process.Start(info) ?? throw new InvalidOperationException("dotnet did not start."));
    }

    /// <summary>Reads the child's output until it acknowledged <paramref name="id"/>; false if it ended or timed out first.</summary>
    public bool WaitForAcknowledged(int id, TimeSpan timeout)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (Acknowledged < id)
        {
            var left = deadline - DateTime.UtcNow;
            if (left <= TimeSpan.Zero || !_lines.TryTake(out string? line, left))
            {
                return false;
            }

            Take(line);
        }

        return true;
    }

    /// <summary>Kills the child at once (SIGKILL on Linux), then reads whatever it printed before dying.</summary>
    public void Kill()
    {
        _process.Kill(entireProcessTree: true);
        WaitForExit(TimeSpan.FromSeconds(30));
    }

    /// <summary>Waits for the child to end and reads the rest of its output; returns its exit code.</summary>
    public int WaitForExit(TimeSpan timeout)
    {
        if (!_process.WaitForExit(timeout))
        {
            _process.Kill(entireProcessTree: true);
            Assert.Fail($"The writer process did not end within {timeout}. Its errors: {Errors}");
        }

        _process.WaitForExit(); // drains the redirected output
        foreach (string line in _lines.GetConsumingEnumerable())
        {
            Take(line);
        }

        return _process.ExitCode;
    }

    public string Errors
    {
        get
        {
            lock (_errors)
            {
                return _errors.ToString();
            }
        }
    }

    public bool HasExited => _process.HasExited;

    public void Dispose()
    {
        if (!_process.HasExited)
        {
            _process.Kill(entireProcessTree: true);
        }

        _process.Dispose();
        _lines.Dispose();
    }

    private void Take(string line)
    {
        if (line.StartsWith("saved ", StringComparison.Ordinal))
        {
            int id = int.Parse(line.AsSpan(6));
            AcknowledgedIds.Add(id);
            Acknowledged = Math.Max(Acknowledged, id);
        }
    }

    // The SDK names the dotnet it runs under in DOTNET_HOST_PATH; outside it, dotnet on PATH.
    private static string DotnetHost() =>
        Environment.GetEnvironmentVariable("DOTNET_HOST_PATH") is { Length: > 0 } host && File.Exists(host) ? host : "dotnet";
}
