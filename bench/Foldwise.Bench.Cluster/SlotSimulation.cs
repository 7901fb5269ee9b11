using System.Diagnostics;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Microsoft.Extensions.Time.Testing;

namespace Foldwise.Bench.Cluster;

/// <summary>
/// 256 slots against the real SearchCoordinator and ScheduleFactory on a fake clock. A trial's time is
/// log-normal (σ = 0.6) and proportional to its rounds; 3 % of runs straggle at 8× (invented workload).
/// A slot told to wait asks again after 1 s of simulated time, as SlotRunner polls. When a trial has two
/// copies (a backup of a straggler), the losing copy stops at its next renewal, 30 s later at most.
/// </summary>
internal static class SlotSimulation
{
    private const double RenewalSeconds = 30;

    public static int Run(int slots, int trials, bool tpe, bool backups)
    {
        var definition = BenchDefinitions.Asha(trials, tpe ? ProposerKind.Tpe : ProposerKind.Random);
        var clock = new FakeTimeProvider(new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero));
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), new NullJournal(), clock,
            new CoordinatorOptions { LeaseDuration = TimeSpan.FromHours(10), BackupAfter = backups ? 2.0 : null });
        var random = new Random(11);
        var start = clock.GetUtcNow();
        // An event is a slot's copy finishing (Trial set) or a slot asking for work; a slot's generation makes a cancelled copy's event stale.
        var events = new PriorityQueue<(int Slot, int Generation, TrialRecord? Trial), DateTimeOffset>();
        var generation = new int[slots];
        var copies = new Dictionary<int, List<(int Slot, DateTimeOffset Started)>>();
        for (int s = 0; s < slots; s++)
        {
            events.Enqueue((s, 0, null), start);
        }

        double useful = 0, wasted = 0;
        var intervals = new List<(double Start, double End)>();
        DateTimeOffset? lastCreated = null;
        int waits = 0, waitsWhileCreating = 0, maxId = 0, backupCopies = 0;
        var wall = Stopwatch.StartNew();
        while (events.TryDequeue(out var e, out var at))
        {
            if (e.Generation != generation[e.Slot])
            {
                continue;
            }

            if (at > clock.GetUtcNow())
            {
                clock.SetUtcNow(at);
            }

            var now = clock.GetUtcNow();
            if (e.Trial is { } done)
            {
                double score = 0.5 + random.NextDouble() * 0.1 - (done.Budget / 10_000.0);
                var mine = copies[done.Id].Find(c => c.Slot == e.Slot);
                if (coordinator.Complete(done.Id, done.Attempt, score, [score]))
                {
                    useful += (now - mine.Started).TotalSeconds;
                    intervals.Add(((mine.Started - start).TotalSeconds, (now - start).TotalSeconds));
                    foreach (var other in copies[done.Id].Where(c => c.Slot != e.Slot))
                    {
                        // The other copy learns it lost at its next renewal and asks for work again.
                        wasted += (now - other.Started).TotalSeconds + RenewalSeconds;
                        generation[other.Slot]++;
                        events.Enqueue((other.Slot, generation[other.Slot], null), now.AddSeconds(RenewalSeconds));
                    }

                    copies.Remove(done.Id);
                }
                else
                {
                    wasted += (now - mine.Started).TotalSeconds;
                    copies[done.Id].Remove(mine);
                }
            }

            var grant = coordinator.Lease("sim-" + e.Slot, e.Slot.ToString());
            if (grant.Kind == LeaseKind.Granted)
            {
                var trial = grant.Trial!;
                double seconds = trial.Budget * 0.2 * Math.Exp(0.6 * Normal(random)) * (random.NextDouble() < 0.03 ? 8 : 1);
                if (!copies.TryGetValue(trial.Id, out var list))
                {
                    copies[trial.Id] = list = [];
                }
                else
                {
                    backupCopies++;
                }

                list.Add((e.Slot, now));
                events.Enqueue((e.Slot, generation[e.Slot], trial), now.AddSeconds(seconds));
                if (trial.Id > maxId)
                {
                    // A new id: the schedule created a trial (the coordinator's Progress() is O(trials), kept out of the loop).
                    maxId = trial.Id;
                    lastCreated = now;
                }
            }
            else if (grant.Kind == LeaseKind.Wait)
            {
                waits++;
                waitsWhileCreating += maxId < trials ? 1 : 0;
                events.Enqueue((e.Slot, generation[e.Slot], null), now.AddSeconds(1));
            }
        }

        var progress = coordinator.Progress();
        double makespan = (clock.GetUtcNow() - start).TotalSeconds;
        double steady = ((lastCreated ?? clock.GetUtcNow()) - start).TotalSeconds;
        Console.WriteLine($"slots {slots}, proposer {definition.Schedule.Proposer}, backups {(backups ? "on" : "off")}, trials done {progress.Done} of {trials}, " +
                          $"backup copies {backupCopies}, wait replies {waits} ({waitsWhileCreating} while the budget allowed new trials), wall {wall.Elapsed.TotalSeconds:F1} s");
        Console.WriteLine($"simulated makespan {makespan / 3600:F2} h; useful slot utilisation over the whole run {useful / (slots * makespan):P1}" +
                          $" (copies that lost: {wasted / (slots * makespan):P1} of slot time)");
        // After the budget is spent nothing is left to start: the tail is the last trials finishing.
        double inSteady = intervals.Sum(i => Math.Max(0, Math.Min(i.End, steady) - i.Start));
        Console.WriteLine($"until the last trial was created ({steady / 3600:F2} h): useful utilisation {inSteady / (slots * steady):P1}; " +
                          $"the drain after it: {(makespan - steady) / 3600:F2} h");
        return 0;
    }

    private static double Normal(Random random) =>
        Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
}
