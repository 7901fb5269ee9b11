using Foldwise.Cluster.Workers;
using Foldwise.Core.Learning;
using Foldwise.Learners;

namespace Foldwise.Bench.WholeSearch;

/// <summary>
/// The two settings compared. <c>before</c>: the former default, ML.NET's LightGBM trainer in one slot training with
/// every core, OpenMP's wait policy passive (the former default re-launched itself with it). <c>after</c>: today's
/// default, LightGBM through its C API, one single-threaded slot per core, the wait policy left alone.
/// </summary>
internal sealed record Setting(string Name, string Description, int Slots, int? Threads, string? WaitPolicy, ILearnerCatalog Learners)
{
    public static Setting Named(string name) => name switch
    {
        "before" => new(name, $"ML.NET's LightGBM trainer, 1 slot x {Environment.ProcessorCount} threads, OMP_WAIT_POLICY=passive", 1, Environment.ProcessorCount, "passive", new ReferenceLightGbmCatalog()),
        "after" => new(name, $"LightGBM's C API, {WorkerOptions.DefaultSlots} slots x 1 thread", WorkerOptions.DefaultSlots, null, null, LearnerCatalog.BuiltIn),
        _ => throw new ArgumentException($"unknown setting '{name}': before or after"),
    };
}
