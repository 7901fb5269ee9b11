namespace Foldwise.Cluster.Workers;

/// <summary>
/// A worker's slots. Defaults: one slot per core, each fit single-threaded — fits of a few thousand rows gain little
/// from a second thread, while fits side by side scale with the cores (measured: bench/Foldwise.Bench.FoldFit --pair).
/// </summary>
public sealed class WorkerOptions
{
    public const string SectionName = "Foldwise:Worker";

    /// <summary>The name trials record as their machine. The default is the host name.</summary>
    public string Name { get; set; } = Environment.MachineName;

    /// <summary>The default slot count: the machine's cores.</summary>
    public static int DefaultSlots => Environment.ProcessorCount;

    /// <summary>Slots asking for trials. The default is <see cref="DefaultSlots"/>; <c>0</c> makes a coordinator that trains nothing.</summary>
    public int Slots { get; set; } = DefaultSlots;

    /// <summary>Threads each slot's learner may use. The default is 1 whatever the slot count (<see cref="Threads"/>).</summary>
    public int? ThreadsPerSlot { get; set; }

    /// <summary>Where fetched tables are kept between searches. The default is <c>~/.cache/foldwise/tables</c>.</summary>
    public string CacheDirectory { get; set; } = Path.Combine(
        Environment.GetFolderPath(Environment.SpecialFolder.UserProfile), ".cache", "foldwise", "tables");

    /// <summary>
    /// The most the table cache may hold; the least recently used tables are deleted beyond it (never the table just
    /// fetched). The default is <c>4 GiB</c>.
    /// </summary>
    public long CacheLimitBytes { get; set; } = 4L << 30;

    /// <summary>How long a slot waits before asking again when there is nothing to start. The default is <c>250 ms</c>.</summary>
    public TimeSpan PollInterval { get; set; } = TimeSpan.FromMilliseconds(250);

    /// <summary>Only work on this search; null asks the coordinator's board.</summary>
    public string? SearchId { get; set; }

    /// <summary>The build this worker tells the coordinator when it joins. The default is this build's (<see cref="Core.BuildVersion"/>).</summary>
    public string Version { get; set; } = Core.BuildVersion.Text;

    /// <summary>Leave when the search this worker worked on has finished, instead of waiting for the next. The default is <c>false</c>.</summary>
    public bool LeaveWhenDone { get; set; }

    /// <summary>
    /// One thread per fit unless asked otherwise, also when there are fewer slots than cores: a user who gives fewer
    /// slots is usually leaving cores to other programs, and LightGBM's threads of one fit wait for each other by
    /// spinning, which collapses beside busy programs. A 25-round LightGBM trial on an 809-row table, in a search with
    /// one slot (then 2 threads per fit) beside other work, took up to 29.3 s; the same parameters at one thread took
    /// under 0.1 s (measured 2026-12-05). Two threads per fit never beat two single-threaded fits up to 1,000,000 rows
    /// on a quiet machine (bench/Foldwise.Bench.FoldFit --pair --table rowsN).
    /// </summary>
    public int Threads => ThreadsPerSlot ?? 1;

    public void Validate()
    {
        if (Slots < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(Slots), Slots, "slots cannot be negative");
        }

        if (ThreadsPerSlot is < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(ThreadsPerSlot), ThreadsPerSlot, "a slot needs at least one thread");
        }
    }
}
