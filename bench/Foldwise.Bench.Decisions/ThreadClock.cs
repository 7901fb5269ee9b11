using System.Runtime.InteropServices;

namespace Foldwise.Bench.Decisions;

/// <summary>
/// CPU time of the calling thread (Linux CLOCK_THREAD_CPUTIME_ID). On a shared machine wall time includes the time
/// other processes hold the core; thread CPU time is what a decision itself costs.
/// </summary>
internal static partial class ThreadClock
{
    private const int ThreadCpuTimeId = 3;

    public static bool Available { get; } = OperatingSystem.IsLinux();

    /// <summary>Thread CPU time in milliseconds, or 0 where the clock is not available.</summary>
    public static double Milliseconds()
    {
        if (!Available)
        {
            return 0;
        }

        _ = GetTime(ThreadCpuTimeId, out var t);
        return (t.Seconds * 1e3) + (t.Nanoseconds / 1e6);
    }

    [StructLayout(LayoutKind.Sequential)]
    private struct TimeSpec
    {
        public long Seconds;
        public long Nanoseconds;
    }

    [DllImport("libc", EntryPoint = "clock_gettime")]
    private static extern int GetTime(int clock, out TimeSpec time);
}
