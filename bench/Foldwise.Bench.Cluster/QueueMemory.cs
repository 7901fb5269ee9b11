using System.Collections.Immutable;
using System.Diagnostics;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Bench.Cluster;

/// <summary>Managed heap of a coordinator holding N queued trials (a resumed search), for N up to 100,000.</summary>
internal static class QueueMemory
{
    public static int Run()
    {
        foreach (int n in new[] { 10_000, 50_000, 100_000 })
        {
            long empty = Heap();
            var history = Queued(n);
            var definition = BenchDefinitions.Asha(n + 10, ProposerKind.Random);
            long before = Heap();
            var clock = Stopwatch.StartNew();
            var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), new NullJournal(), TimeProvider.System, null, history);
            double build = clock.Elapsed.TotalMilliseconds;
            long after = Heap();
            clock.Restart();
            for (int i = 0; i < 1000; i++)
            {
                var grant = coordinator.Lease("w", "0");
                coordinator.Complete(grant.Trial!.Id, grant.Trial.Attempt, 0.5, [0.5]);
            }

            double perLease = clock.Elapsed.TotalMilliseconds / 1000;
            long held = after - before;
            long total = after - empty;
            Console.WriteLine($"{n,7:N0} queued: {total / (double)n,5:F0} bytes per queued trial in all (records {(before - empty) / (double)n:F0} + " +
                              $"coordinator/schedule index {held / (double)n:F0}); {total / 1e6:F1} MB; replay {build:F0} ms; lease+complete {perLease * 1000:F0} µs");
            GC.KeepAlive(coordinator);
            GC.KeepAlive(history);
        }

        return 0;
    }

    private static List<TrialRecord> Queued(int n)
    {
        var space = DefaultSpaces.LightGbm;
        var random = new Random(3);
        var list = new List<TrialRecord>(n);
        for (int i = 1; i <= n; i++)
        {
            var parameters = ParameterSet.Of(space.Ranges.ToDictionary(p => p.Name, p => p.Low + (random.NextDouble() * (p.High - p.Low))));
            list.Add(new TrialRecord
            {
                Id = i, Family = FamilyNames.LightGbm, Parameters = parameters, Budget = 25, Rung = 0,
                Proposer = "random", Created = DateTimeOffset.UnixEpoch, State = TrialState.Queued,
            });
        }

        return list;
    }

    private static long Heap()
    {
        GC.Collect();
        GC.WaitForPendingFinalizers();
        GC.Collect();
        return GC.GetTotalMemory(true);
    }
}
