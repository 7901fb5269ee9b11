using System.Diagnostics;
using Foldwise.Bench.Decisions;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

// Replays 10,000 synthetic trials through an ASHA + TPE schedule (2 families × 6 parameters), then times
// 10,000 further decisions: NextPlan plus the Observe calls of the trial it creates (queued, running) and of one
// running trial finishing with a synthetic score, 16 trials running throughout.
const int History = 10_000;
const int Decisions = 10_000;
const int Slots = 16;

var definition = new SearchDefinition
{
    Name = "bench",
    Data = new DataSource("/bench/train.csv", "/bench/test.csv", "id", "target"),
    Families =
    [
        new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm),
        new FamilySearch(FamilyNames.FastTree, new ParameterSpace([.. DefaultSpaces.FastTree.Ranges, ParameterRange.OneOf("bagging", "off", "on")])),
    ],
    Schedule = new ScheduleOptions(ScheduleKind.Asha, ProposerKind.Tpe, FirstRung: 25, FullBudget: 400, Eta: 3),
    Budget = new SearchBudget(Trials: History + Decisions + Slots, Hours: null),
    Seed = 1,
};

var clock = Stopwatch.StartNew();
var source = new Simulation(ScheduleFactory.Create(definition), seed: 2);
while (source.Created < History)
{
    source.Step(Slots);
}

Console.WriteLine($"generated {source.Created} trials ({source.Journal.Count} records) in {clock.Elapsed.TotalSeconds:F1} s");

clock.Restart();
var schedule = ScheduleFactory.Create(definition);
foreach (var record in source.Journal)
{
    schedule.Observe(record);
}

Console.WriteLine($"replayed {source.Journal.Count} records into a fresh schedule in {clock.Elapsed.TotalMilliseconds:F0} ms");
bool same = schedule.NextPlan() == source.Schedule.NextPlan();
Console.WriteLine($"fresh schedule's next plan equals the original's: {same}");

var run = source.Continue(schedule);
var wall = new double[Decisions];
var cpu = new double[Decisions];
int gen0 = GC.CollectionCount(0), gen2 = GC.CollectionCount(2);
for (int i = 0; i < Decisions; i++)
{
    double cpuStart = ThreadClock.Milliseconds();
    long start = Stopwatch.GetTimestamp();
    run.Step(Slots);
    wall[i] = Stopwatch.GetElapsedTime(start).TotalMilliseconds;
    cpu[i] = ThreadClock.Milliseconds() - cpuStart;
}

Console.WriteLine($"{Decisions} decisions with {run.Created - Decisions}..{run.Created} trials in history " +
    $"(GC during them: {GC.CollectionCount(0) - gen0} gen0, {GC.CollectionCount(2) - gen2} gen2)");
Console.WriteLine($"  wall time  : {Summary(wall)}");
if (ThreadClock.Available)
{
    Console.WriteLine($"  thread CPU : {Summary(cpu)}");
}

Console.WriteLine($"plans: {run.Promotions} promotions, {run.Modelled} TPE proposals, {run.Randoms} random; " +
    $"trials per budget: {string.Join(", ", run.TrialsPerBudget.OrderBy(kv => kv.Key).Select(kv => $"{kv.Key}:{kv.Value}"))}");
Console.WriteLine($"load average at the end: {LoadAverage()}");

// Optional: BENCH_TPE_WINDOWS=256,128,64 prints the proposer's own cost on this history for other window sizes.
if (Environment.GetEnvironmentVariable("BENCH_TPE_WINDOWS") is string windows)
{
    var history = new FamilyHistory(FamilyNames.LightGbm, DefaultSpaces.LightGbm);
    foreach (var record in source.Journal.Where(r => r.Family == FamilyNames.LightGbm))
    {
        history.Observe(record);
    }

    foreach (int window in windows.Split(',').Select(int.Parse))
    {
        var tpe = new TpeProposer(new TpeOptions(Window: window));
        double begin = ThreadClock.Milliseconds();
        for (int i = 0; i < 2000; i++)
        {
            tpe.Propose(history, new Random(i));
        }

        Console.WriteLine($"TPE window {window}: {(ThreadClock.Milliseconds() - begin) / 2000:F3} ms thread CPU per proposal (fit cached)");
    }
}

return same ? 0 : 1;

static string Summary(double[] values)
{
    var sorted = values.Order().ToArray();
    double Quantile(double q) => sorted[Math.Min(sorted.Length - 1, (int)Math.Ceiling(q * sorted.Length) - 1)];
    return $"p50 {Quantile(0.50):F3} ms, p99 {Quantile(0.99):F3} ms, max {sorted[^1]:F3} ms, mean {values.Average():F3} ms";
}

static string LoadAverage() => File.Exists("/proc/loadavg") ? File.ReadAllText("/proc/loadavg").Trim() : "n/a";
