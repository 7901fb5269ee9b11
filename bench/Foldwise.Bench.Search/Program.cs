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
                  $"rounds {options.Min}..{options.Max}, eta {options.Eta}; random {options.RandomTrials} trials at {options.Max}; ASHA+TPE up to {options.AshaTrials} trials; {options.Threads} threads");
var fractions = new List<double>();
Console.WriteLine("seed  random best  random compute  asha best  asha compute to reach  fraction  asha trials  wall s (random, asha)");
for (int seed = 1; seed <= options.Seeds; seed++)
{
    var metric = Metric.Rmsle;
    var folds = StratifiedFoldPlanner.Create([.. train.Target.Select(metric.Forward)], 5, seed);
    var data = TrialData.From(train, test, folds, metric);
    var random = Search.Run(data, options, ScheduleKind.Full, ProposerKind.Random, options.RandomTrials, seed);
    var asha = Search.Run(data, options, ScheduleKind.Asha, ProposerKind.Tpe, options.AshaTrials, seed);
    double target = random.Steps[^1].Best;
    double randomCompute = random.Steps[^1].Compute;
    var reached = asha.Steps.FirstOrDefault(s => s.Best <= target);
    double fraction = reached is null ? double.PositiveInfinity : reached.Compute / randomCompute;
    fractions.Add(fraction);
    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"{seed,4}  {target,11:F5}  {randomCompute,14:E3}  {asha.Steps.Min(s => s.Best),9:F5}  {(reached is null ? "not reached" : reached.Compute.ToString("E3", CultureInfo.InvariantCulture)),21}  {(reached is null ? "  >1" : fraction.ToString("P1", CultureInfo.InvariantCulture)),8}  {asha.Steps.Count,11}  {random.Seconds,6:F0} {asha.Seconds,6:F0}"));
}

fractions.Sort();
double median = fractions[fractions.Count / 2];
Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
    $"median fraction of random search's compute that ASHA+TPE needed to match its final best: {(double.IsInfinity(median) ? "not reached" : median.ToString("P1", CultureInfo.InvariantCulture))} (aim: ≤ 25%)"));

internal sealed record Step(double Compute, double Best);

internal sealed record SearchTrace(List<Step> Steps, double Seconds);

internal static class Search
{
    public static SearchTrace Run(TrialData data, Args options, ScheduleKind kind, ProposerKind proposer, int trials, int seed)
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
            int.Parse(Get("--asha-trials", "40"), CultureInfo.InvariantCulture),
            int.Parse(Get("--min", "20"), CultureInfo.InvariantCulture),
            int.Parse(Get("--max", "180"), CultureInfo.InvariantCulture),
            int.Parse(Get("--eta", "3"), CultureInfo.InvariantCulture),
            int.Parse(Get("--threads", "2"), CultureInfo.InvariantCulture),
            Get("--family", FamilyNames.LightGbm));
    }
}
