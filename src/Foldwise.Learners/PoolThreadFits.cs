namespace Foldwise.Learners;

/// <summary>
/// Runs an ML.NET fit on a thread of the .NET thread pool. ML.NET's FastTree, forest and GAM trainers, set to one
/// thread, hand every feature group's share of every split to the pool and wait for it (<c>Task.Run</c>, then
/// <c>Wait</c>). A waiting pool thread runs such work itself; any other thread waits until a pool thread is scheduled,
/// once per hand-off. Beside 4 busy processes on 2 cores a 100-tree FastTree trial on the quick demo did not finish in
/// 300 s from a slot's own thread (3.7 s of CPU used), and took 7.4 s from a pool thread; with the machine otherwise
/// busy at a load near 4, 5.0 s against 1.7 s (bench/Foldwise.Bench.Families, measured 2026-12-05; PoolThreadFitsTests
/// pins where the fit runs, and that it predicts the same).
/// </summary>
internal static class PoolThreadFits
{
    private static readonly Lock Gate = new();
    private static int running;
    private static int baseline = -1;

    /// <summary>
    /// Runs <paramref name="fit"/> on a pool thread and waits for it. While it runs the pool's minimum thread count is
    /// raised by one, so the pool still has its usual threads at once for the rest of the process (a worker's
    /// messages and lease renewals) instead of waiting for the pool to notice a thread is taken.
    /// </summary>
    public static T Run<T>(Func<T> fit)
    {
        ArgumentNullException.ThrowIfNull(fit);
        if (Thread.CurrentThread.IsThreadPoolThread)
        {
            return fit();
        }

        Reserve(+1);
        try
        {
            return Task.Run(fit).GetAwaiter().GetResult();
        }
        finally
        {
            Reserve(-1);
        }
    }

    private static void Reserve(int change)
    {
        lock (Gate)
        {
            ThreadPool.GetMinThreads(out int workers, out int completion);
            if (baseline < 0)
            {
                baseline = workers;
            }

            running += change;
            ThreadPool.SetMinThreads(baseline + running, completion);
        }
    }
}
