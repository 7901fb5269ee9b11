using System.Diagnostics;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Bench.Cluster;

/// <summary>
/// 256 slots against the real SearchCoordinator and ScheduleFactory on a fake clock. A trial's time is
/// log-normal (σ = 0.6) and proportional to its rounds; 3 % of trials straggle at 8× (invented workload).
/// A slot told to wait asks again after 1 s of simulated time, as SlotRunner polls.
/// </summary>
internal static class SlotSimulation
{
    public static int Run(int slots, int trials, bool tpe)
    {
        var definition = BenchDefinitions.Asha(trials, tpe ? ProposerKind.Tpe : ProposerKind.Random);
        var clock = new FakeTimeProvider(new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero));
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), new NullJournal(), clock,
            new CoordinatorOptions { LeaseDuration = TimeSpan.FromHours(10) });
        var random = new Random(11);
        var events = new PriorityQueue<(int Slot, TrialRecord? Trial, double Seconds), DateTimeOffset>();
        var start = clock.GetUtcNow();
        for (int s = 0; s < slots; s++)
        {
            events.Enqueue((s, null, 0), start);
        }

        double busy = 0;
        var intervals = new List<(double Start, double End)>();
        DateTimeOffset? lastCreated = null;
        int waits = 0, waitsWhileCreating = 0, maxId = 0;
        var wall = Stopwatch.StartNew();
        while (events.TryDequeue(out var e, out var at))
        {
            if (at > clock.GetUtcNow())
            {
                clock.SetUtcNow(at);
            }

            if (e.Trial is { } done)
            {
                double score = 0.5 + random.NextDouble() * 0.1 - (done.Budget / 10_000.0);
                coordinator.Complete(done.Id, done.Attempt, score, [score]);
            }

            var grant = coordinator.Lease("sim", e.Slot.ToString());
            if (grant.Kind == LeaseKind.Granted)
            {
                var trial = grant.Trial!;
                double seconds = trial.Budget * 0.2 * Math.Exp(0.6 * Normal(random)) * (random.NextDouble() < 0.03 ? 8 : 1);
                busy += seconds;
                double from = (clock.GetUtcNow() - start).TotalSeconds;
                intervals.Add((from, from + seconds));
                events.Enqueue((e.Slot, trial, seconds), clock.GetUtcNow().AddSeconds(seconds));
                if (trial.Id > maxId)
                {
                    // A new id: the schedule created a trial (the coordinator's Progress() is O(trials), kept out of the loop).
                    maxId = trial.Id;
                    lastCreated = clock.GetUtcNow();
                }
            }
            else if (grant.Kind == LeaseKind.Wait)
            {
                waits++;
                waitsWhileCreating += maxId < trials ? 1 : 0;
                events.Enqueue((e.Slot, null, 0), clock.GetUtcNow().AddSeconds(1));
            }
        }

        var progress = coordinator.Progress();
        double makespan = (clock.GetUtcNow() - start).TotalSeconds;
        double steady = ((lastCreated ?? clock.GetUtcNow()) - start).TotalSeconds;
        Console.WriteLine($"slots {slots}, proposer {definition.Schedule.Proposer}, trials done {progress.Done} of {trials}, " +
                          $"wait replies {waits} ({waitsWhileCreating} while the budget allowed new trials), wall {wall.Elapsed.TotalSeconds:F1} s");
        Console.WriteLine($"simulated makespan {makespan / 3600:F2} h; slot utilisation over the whole run {busy / (slots * makespan):P1}");
        // The tail after the budget is spent is idle by construction (nothing left to start); report the steady part too.
        double inSteady = intervals.Sum(i => Math.Max(0, Math.Min(i.End, steady) - i.Start));
        Console.WriteLine($"until the last trial was created ({steady / 3600:F2} h): utilisation {inSteady / (slots * steady):P1}; " +
                          $"the drain after it ({(makespan - steady) / 3600:F2} h) is the stragglers finishing with nothing left to start");
        return 0;
    }

    private static double Normal(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
