using System.Diagnostics;
using System.Globalization;
using Foldwise.Bench.FoldFit;
using Foldwise.Core.Data;
using Foldwise.Core.Demo;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

// Measures one 5-fold LightGBM trial on the Full freight demo through the real TrialExecutor path,
// and optionally writes the same data and folds for the python peer script.
if (args.Length > 0 && args[0] == "--pair-child")
{
    return PairBench.Child(args);
}

if (args.Contains("--memory"))
{
    return MemoryProbe.Run(args);
}

if (args.Contains("--pair"))
{
    return PairBench.Run(args);
}

var options = BenchOptions.Parse(args);
var size = options.Size == "quick" ? DemoSize.Quick : DemoSize.Full;
var clock = Stopwatch.StartNew();
var (train, test) = FreightDemo.Generate(size, options.Seed);
Console.WriteLine($"demo {size} seed {options.Seed}: train {train.RowCount} x {train.FeatureCount}, density {train.Density:F4}, test {test.RowCount} rows; generated in {clock.Elapsed.TotalSeconds:F1} s");
PrintTarget(train);

var folds = SeededKFold.Plan(train.RowCount, 5, options.Seed);
if (options.WriteDirectory is { } directory)
{
    Write(train, test, folds, directory);
}

clock.Restart();
var data = TrialData.From(train, test, folds, Metric.Rmsle);
Console.WriteLine($"rows built in {clock.Elapsed.TotalSeconds:F1} s");

var parameters = new Dictionary<string, double>
{
    ["learning_rate"] = 0.05,
    ["leaves"] = 31,
    ["min_leaf_rows"] = 20,
    ["feature_fraction"] = 0.5,
    ["row_fraction"] = 0.8,
    ["l2"] = 1,
};
if (options.Trial)
{
    var perFold = new List<double>();
    clock.Restart();
    var lap = Stopwatch.StartNew();
    var outcome = new TrialExecutor(new LightGbmLearner()).Run(
        data, ParameterSet.Of(parameters), options.Rounds, options.Seed, options.Threads, CancellationToken.None, _ =>
        {
            perFold.Add(lap.Elapsed.TotalSeconds);
            lap.Restart();
        });
    Console.WriteLine($"lightgbm 5-fold trial, {options.Rounds} rounds, {options.Threads} threads: wall {clock.Elapsed.TotalSeconds:F1} s");
    Console.WriteLine($"  per-fold seconds: {string.Join(" ", perFold.Select(s => s.ToString("F1")))}");
    Console.WriteLine($"  fold RMSLE: {string.Join(" ", outcome.FoldScores.Select(s => s.ToString("F4")))}");
    Console.WriteLine($"  OOF RMSLE {outcome.Score:F4}; predicting the mean: {MeanBaseline(data):F4}");
}

if (options.Trial)
{
    // One fold at 1 round: roughly the fixed cost of a fold (LightGBM's dataset, scoring 600 + 12,000 rows).
    var one = new FoldJob(data, 0, folds.TrainRows(0), folds.ValidationRows(0), ParameterSet.Of(parameters), 1, options.Seed, options.Threads);
    clock.Restart();
    new LightGbmLearner().Fit(one, CancellationToken.None);
    Console.WriteLine($"lightgbm fold 0 at 1 round (fixed cost of a fold): {clock.Elapsed.TotalSeconds:F1} s");
}

if (options.FastTree)
{
    parameters.Remove("l2");
    var job = new FoldJob(data, 0, folds.TrainRows(0), folds.ValidationRows(0), ParameterSet.Of(parameters), options.Rounds, options.Seed, options.Threads);
    clock.Restart();
    var prediction = new FastTreeLearner().Fit(job, CancellationToken.None);
    double score = data.Metric.Score([.. job.ValidationRows.Select(r => data.Target[r])], prediction.Validation);
    Console.WriteLine($"fasttree fold 0, {options.Rounds} trees, {options.Threads} threads: {clock.Elapsed.TotalSeconds:F1} s, fold RMSLE {score:F4}");
}

return 0;

static void PrintTarget(FeatureTable train)
{
    var sorted = train.Target.Order().ToArray();
    Console.WriteLine($"q1_spend: min {sorted[0]:F2} median {sorted[sorted.Length / 2]:F2} mean {sorted.Average():F2} p99 {sorted[(int)(sorted.Length * 0.99)]:F2} max {sorted[^1]:F2}");
}

static double MeanBaseline(TrialData data)
{
    double mean = data.Target.Average();
    return data.Metric.Score(data.Target, [.. data.Target.Select(_ => mean)]);
}

static void Write(FeatureTable train, FeatureTable test, Foldwise.Core.Folds.FoldPlan folds, string directory)
{
    var clock = Stopwatch.StartNew();
    DemoCsvWriter.Write(train, Path.Combine(directory, "train.csv"), FreightDemo.IdColumn, FreightDemo.TargetColumn);
    double trainSeconds = clock.Elapsed.TotalSeconds;
    clock.Restart();
    DemoCsvWriter.Write(test, Path.Combine(directory, "test.csv"), FreightDemo.IdColumn, null);
    double testSeconds = clock.Elapsed.TotalSeconds;
    using (var writer = new StreamWriter(Path.Combine(directory, "folds.csv")))
    {
        writer.Write($"row,{FreightDemo.IdColumn},fold\n");
        for (int r = 0; r < folds.RowCount; r++)
        {
            writer.Write(string.Create(CultureInfo.InvariantCulture, $"{r},{train.Ids[r]},{folds.FoldOfRow[r]}\n"));
        }
    }

    long MB(string name) => new FileInfo(Path.Combine(directory, name)).Length >> 20;
    Console.WriteLine($"wrote {directory}: train.csv {MB("train.csv")} MB in {trainSeconds:F1} s, test.csv {MB("test.csv")} MB in {testSeconds:F1} s, folds.csv");
}
