using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Data;
using Foldwise.Core.Demo;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;
using Foldwise.Csv;
using Foldwise.Learners;

// Trial cost per family: one 5-fold trial of each family in turn, at the budget given for it, with the middle of its
// default space, on the demo table or on a CSV pair; repeated in rounds so that load from elsewhere hits all alike.
//   --demo quick|full (default full) | --train F --test F --id C --target C
//   --budgets lightgbm=400,fasttree=400,forest=300,gam=1000,linear=50   --rounds 2   --threads 1   --seed 1
//   --busy N: N busy-loop processes run beside the trials (a shared machine), stopped at the end
//   --set leaves=47,l2=0.002: parameter values instead of the middle of the space (for every family that has them)
var options = args.Select((a, i) => (a, i)).Where(p => p.a.StartsWith("--", StringComparison.Ordinal))
    .ToDictionary(p => p.a, p => p.i + 1 < args.Length ? args[p.i + 1] : "", StringComparer.Ordinal);
string Get(string name, string fallback) => options.TryGetValue(name, out var v) ? v : fallback;

int seed = int.Parse(Get("--seed", "1"), CultureInfo.InvariantCulture);
int threads = int.Parse(Get("--threads", "1"), CultureInfo.InvariantCulture);
int rounds = int.Parse(Get("--rounds", "2"), CultureInfo.InvariantCulture);
var budgets = Get("--budgets", "lightgbm=400,fasttree=400,forest=300,gam=1000,linear=50").Split(',')
    .Select(b => b.Split('=')).ToDictionary(b => b[0], b => int.Parse(b[1], CultureInfo.InvariantCulture));

FeatureTable train, test;
string source;
if (options.ContainsKey("--train"))
{
    train = CsvTableReader.ReadTraining(Get("--train", ""), Get("--id", "id"), Get("--target", ""), Metric.Rmsle);
    test = CsvTableReader.ReadTest(Get("--test", ""), Get("--id", "id"), null);
    source = Path.GetFileName(Get("--train", ""));
}
else
{
    var size = Get("--demo", "full") == "quick" ? DemoSize.Quick : DemoSize.Full;
    (train, test) = FreightDemo.Generate(size, seed);
    source = $"demo {size}";
}

var screen = ColumnScreen.Screen(train, new ScreeningOptions());
train = ColumnScreen.Apply(screen, train);
test = ColumnScreen.Apply(screen, test);
var target = train.Target.Select(Metric.Rmsle.Forward).ToArray();
var data = TrialData.From(train, test, StratifiedFoldPlanner.Create(target, 5, seed), Metric.Rmsle);
Console.WriteLine($"{source}: {train.RowCount} training rows x {train.FeatureCount} columns, {test.RowCount} test rows; {threads} thread(s); load {File.ReadAllText("/proc/loadavg").Trim()}");

var seconds = budgets.Keys.ToDictionary(f => f, _ => new List<double>());
var scores = new Dictionary<string, double>();
var busy = Enumerable.Range(0, int.Parse(Get("--busy", "0"), CultureInfo.InvariantCulture))
    .Select(_ => Process.Start("sh", ["-c", "while :; do :; done"])).ToList();
try
{
    for (int round = 0; round < rounds; round++)
    {
        foreach (var (family, budget) in budgets)
        {
            var learner = LearnerCatalog.BuiltIn.Get(family);
            var clock = Stopwatch.StartNew();
            var outcome = new TrialExecutor(learner).Run(data, Chosen(DefaultSpaces.For(family)), budget, seed, threads, CancellationToken.None, _ => { });
            seconds[family].Add(clock.Elapsed.TotalSeconds);
            scores[family] = outcome.Score;
        }
    }
}
finally
{
    busy.ForEach(p => p.Kill());
}

if (busy.Count > 0)
{
    Console.WriteLine($"beside {busy.Count} busy-loop processes; load at the end {File.ReadAllText("/proc/loadavg").Trim()}");
}

double reference = seconds.TryGetValue(FamilyNames.LightGbm, out var l) ? l.Min() : double.NaN;
Console.WriteLine($"{"family",-10} {"budget",7} {"seconds (each round)",-24} {"min",7} {"x lightgbm",10} {"OOF RMSLE",10}");
foreach (var (family, list) in seconds)
{
    Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
        $"{family,-10} {budgets[family],7} {string.Join(" ", list.Select(s => s.ToString("F1", CultureInfo.InvariantCulture))),-24} {list.Min(),7:F1} {list.Min() / reference,10:F2} {scores[family],10:F4}"));
}

ParameterSet Chosen(ParameterSpace space)
{
    var set = Get("--set", "").Split(',', StringSplitOptions.RemoveEmptyEntries).Select(p => p.Split('='))
        .ToDictionary(p => p[0], p => double.Parse(p[1], CultureInfo.InvariantCulture));
    var middle = Middle(space);
    return ParameterSet.Of(space.Ranges.Select(r => KeyValuePair.Create(r.Name, set.TryGetValue(r.Name, out double v) ? v : middle[r.Name])));
}

// The middle of each range: the mean for linear scales, the geometric mean for log scales.
static ParameterSet Middle(ParameterSpace space) => ParameterSet.Of(space.Ranges.Select(r => KeyValuePair.Create(r.Name, r.Kind switch
{
    ParameterKind.Log => Math.Sqrt(r.Low * r.High),
    ParameterKind.Whole or ParameterKind.OneOf => Math.Round((r.Low + r.High) / 2),
    _ => (r.Low + r.High) / 2,
})));
