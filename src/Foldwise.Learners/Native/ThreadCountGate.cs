namespace Foldwise.Learners.Native;

/// <summary>
/// Lets native LightGBM work of one thread count overlap only with work of the same count. LightGBM keeps the thread
/// count of its latest call in one process-wide setting that running loops read, so a fit started with another count
/// would change the count under fits already running. Work with a different count waits until they are done.
/// </summary>
internal static class ThreadCountGate
{
    private static readonly object Gate = new();
    private static int current;
    private static int active;

    public static Scope Enter(int threads)
    {
        lock (Gate)
        {
            while (active > 0 && current != threads)
            {
                Monitor.Wait(Gate);
            }

            current = threads;
            active++;
        }

        return default;
    }

    /// <summary>Leaves the gate when disposed.</summary>
    internal readonly struct Scope : IDisposable
    {
        public void Dispose()
        {
            lock (Gate)
            {
                if (--active == 0)
                {
                    Monitor.PulseAll(Gate);
                }
            }
        }
    }
}
