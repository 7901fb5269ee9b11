// ASHA+TPE against random search at full budget, on the invented freight demo, driven through the real
// coordinator and schedules with one slot (no Orleans: decisions and fits only). Reports, per seed, the
// fraction of compute (boosting rounds × training rows, summed over trials) that ASHA+TPE needed to reach
// random search's final best out-of-fold RMSLE, and the median over seeds.
using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Schedules;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

var options = Args.Parse(args);
var (rawTrain, rawTest) = FreightDemo.Generate(options.Size, seed: 7);
var report = ColumnScreen.Screen(rawTrain, new ScreeningOptions());
var train = ColumnScreen.Apply(report, rawTrain);
var test = ColumnScreen.Apply(report, rawTest);
Console.WriteLine($"table {options.Size}: {train.RowCount} × {train.FeatureCount} after screening; family {options.Family}; " +
                  $"rounds {options.Min}..{options.Max}, eta {options.Eta}; random {options.RandomTrials} trials at {options.Max}; ASHA+TPE until it matches random or spends as much compute; {options.Threads} threads");
// Test predictions are part of every trial but not of the comparison: a 50-row test slice keeps them cheap.
var testRows = test.ToRows();
var testSlice = new Foldwise.Core.Data.SparseRowMatrix(50, testRows.ColumnCount, testRows.RowStarts[..51],
    testRows.ColumnIndices[..testRows.RowStarts[50]], testRows.Values[..testRows.RowStarts[50]]);
int[] targets = [options.RandomTrials / 2, options.RandomTrials];
var fractions = targets.ToDictionary(t => t, _ => new List<double>());
Console.WriteLine("seed  random trials  random best  random compute  asha compute to reach  fraction  asha trials so far  wall s (random, asha)");
for (int seed = 1; seed <= options.Seeds; seed++)
{
    var metric = Metric.Rmsle;
    var folds = StratifiedFoldPlanner.Create([.. train.Target.Select(metric.Forward)], 5, seed);
    var data = TrialData.From(train, test, folds, metric) with { Test = testSlice };
    var random = Search.Run(data, options, ScheduleKind.Full, ProposerKind.Random, options.RandomTrials, seed, stopBelow: double.NegativeInfinity, computeCap: double.PositiveInfinity);
    double finalTarget = random.Steps[^1].Best;
    // ASHA+TPE runs until it matches random's final best or has spent as much compute as random did.
    var asha = Search.Run(data, options, ScheduleKind.Asha, ProposerKind.Tpe, options.AshaTrials, seed, stopBelow: finalTarget, computeCap: random.Steps[^1].Compute);
    foreach (int count in targets)
    {
        double target = random.Steps[count - 1].Best;
        double randomCompute = random.Steps[count - 1].Compute;
        int reachedAt = asha.Steps.FindIndex(s => s.Best <= target);
        double fraction = reachedAt < 0 ? double.PositiveInfinity : asha.Steps[reachedAt].Compute / randomCompute;
        fractions[count].Add(fraction);
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"{seed,4}  {count,13}  {target,11:F5}  {randomCompute,14:E3}  {(reachedAt < 0 ? "not reached" : asha.Steps[reachedAt].Compute.ToString("E3", CultureInfo.InvariantCulture)),21}  {(reachedAt < 0 ? "  >1" : fraction.ToString("P1", CultureInfo.InvariantCulture)),8}  {(reachedAt < 0 ? asha.Steps.Count : reachedAt + 1),18}  {random.Seconds,6:F0} {asha.Seconds,6:F0}"));
    }
}

foreach (int count in targets)
{
    var sorted = fractions[count].Order().ToList();
    double median = sorted[sorted.Count / 2];
    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"random {count} trials: median fraction of its compute that ASHA+TPE needed to match its best: {(double.IsInfinity(median) ? "not reached" : median.ToString("P1", CultureInfo.InvariantCulture))} " +
        $"(seeds: {string.Join(", ", fractions[count].Select(f => double.IsInfinity(f) ? ">1" : f.ToString("P1", CultureInfo.InvariantCulture)))}; aim: ≤ 25%)"));
}

internal sealed record Step(double Compute, double Best);

internal sealed record SearchTrace(List<Step> Steps, double Seconds);

internal static class Search
{
    public static SearchTrace Run(TrialData data, Args options, ScheduleKind kind, ProposerKind proposer, int trials, int seed, double stopBelow, double computeCap)
    {
        var definition = new SearchDefinition
        {
            Name = "bench",
            Data = new DataSource("-", "-", "id", "y"),
            Seed = seed,
            Families = [new FamilySearch(options.Family, DefaultSpaces.For(options.Family))],
            Schedule = new ScheduleOptions(kind, proposer, options.Min, options.Max, options.Eta),
            Budget = new SearchBudget(trials, null),
        };
        var coordinator = new SearchCoordinator(definition, ScheduleFactory.Create(definition), new NoJournal(), TimeProvider.System);
        var executor = new TrialExecutor(LearnerCatalog.BuiltIn.Get(options.Family));
        var steps = new List<Step>();
        double compute = 0, best = double.PositiveInfinity;
        var clock = Stopwatch.StartNew();
        while (true)
        {
            var grant = coordinator.Lease("bench", "0");
            if (grant.Kind != LeaseKind.Granted)
            {
                break;
            }

            var trial = grant.Trial!;
            var outcome = executor.Run(data, trial.Parameters, trial.Budget, grant.Seed, options.Threads, CancellationToken.None);
            coordinator.Complete(trial.Id, trial.Attempt, outcome.Score, outcome.FoldScores);
            compute += (double)trial.Budget * data.Train.RowCount;
            best = Math.Min(best, outcome.Score);
            steps.Add(new Step(compute, best));
            if (best <= stopBelow || compute >= computeCap)
            {
                break;
            }
        }

        return new SearchTrace(steps, clock.Elapsed.TotalSeconds);
    }

    private sealed class NoJournal : ITrialJournal
    {
        public void Save(TrialRecord trial)
        {
        }
    }
}

internal sealed record Args(DemoSize Size, int Seeds, int RandomTrials, int AshaTrials, int Min, int Max, int Eta, int Threads, string Family)
{
    public static Args Parse(string[] args)
    {
        string Get(string name, string fallback)
        {
            int at = Array.IndexOf(args, name);
            return at >= 0 && at + 1 < args.Length ? args[at + 1] : fallback;
        }

        return new Args(
            Enum.Parse<DemoSize>(Get("--size", "Quick"), ignoreCase: true),
            int.Parse(Get("--seeds", "5"), CultureInfo.InvariantCulture),
            int.Parse(Get("--random-trials", "16"), CultureInfo.InvariantCulture),
            int.Parse(Get("--asha-trials", "10000"), CultureInfo.InvariantCulture),
            int.Parse(Get("--min", "20"), CultureInfo.InvariantCulture),
            int.Parse(Get("--max", "180"), CultureInfo.InvariantCulture),
            int.Parse(Get("--eta", "3"), CultureInfo.InvariantCulture),
            int.Parse(Get("--threads", "2"), CultureInfo.InvariantCulture),
            Get("--family", FamilyNames.LightGbm));
    }
}
