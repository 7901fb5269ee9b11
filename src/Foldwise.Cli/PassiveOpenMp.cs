using System.Diagnostics;
using System.Runtime.InteropServices;

namespace Foldwise.Cli;

/// <summary>
/// Training processes must run with <c>OMP_WAIT_POLICY=passive</c>: LightGBM's OpenMP threads otherwise spin while
/// they wait, and under contention a 2-thread fold was measured 3.6× slower (72 s against about 20 s while another core was
/// busy). OpenMP reads the
/// variable when the native library loads and .NET cannot set it for native code from inside the process, so a
/// command that trains re-launches itself once with the variable set, passing the terminal straight through.
/// </summary>
public static class PassiveOpenMp
{
    private const string Variable = "OMP_WAIT_POLICY";
    private static readonly string[] TrainingCommands = ["run", "demo", "resume", "worker"];

    public static bool NeedsRelaunch(string[] args) =>
        args.Length > 0 && TrainingCommands.Contains(args[0]) &&
        string.IsNullOrEmpty(Environment.GetEnvironmentVariable(Variable)) &&
        Environment.GetEnvironmentVariable("FOLDWISE_NO_RELAUNCH") != "1";

    public static async Task<int> RelaunchAsync(string[] args)
    {
        var info = new ProcessStartInfo(OwnCommand.Executable) { UseShellExecute = false };
        foreach (string arg in OwnCommand.Arguments(args))
        {
            info.ArgumentList.Add(arg);
        }

        info.Environment[Variable] = "passive";
        using var child = Process.Start(info) ?? throw new InvalidOperationException("could not start foldwise again with OMP_WAIT_POLICY=passive");

        // Ctrl-C reaches the child through the terminal; the parent only waits for it.
        Console.CancelKeyPress += (_, e) => e.Cancel = true;
        using var terminate = PosixSignalRegistration.Create(PosixSignal.SIGTERM, context =>
        {
            context.Cancel = true;
            _ = Kill(child.Id, 15);
        });
        await child.WaitForExitAsync();
        return child.ExitCode;
    }

    [DllImport("libc", EntryPoint = "kill")]
    [DefaultDllImportSearchPaths(DllImportSearchPath.SafeDirectories)]
#pragma warning disable SYSLIB1054 // LibraryImport needs unsafe code enabled for the whole project; one plain call does not.
    private static extern int Kill(int pid, int signal);
#pragma warning restore SYSLIB1054
}
