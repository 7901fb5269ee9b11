using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Demo;
using Foldwise.Tuning;

// Times 'foldwise predict' on invented new rows of the full demo's shape: end to end and by phase.
// Usage: Foldwise.Bench.Predict --store OUT/search.db [--rows 100000] [--seed 7] [--threads N[,M...]] [--runs 1]
//        [--csv FILE] (the new rows: written there first unless the file exists, and kept; by default a temporary file)
// The store must come from a search of the full-size demo written with the same seed (foldwise demo --data-only),
// so the new rows are further shippers of the same invented world. Each run at each thread count scores the rows once;
// every run's predictions are compared with the first run's.
//        or: --fold-models lightgbm=50,fasttree=50 [--rows N] [--seed 7]: one fold model per family, its size and scoring time
if (Array.IndexOf(args, "--fold-models") is int f and >= 0)
{
    var fits = args[f + 1].Split(',').Select(p => p.Split('=')).Select(p => (p[0], int.Parse(p[1], CultureInfo.InvariantCulture))).ToList();
    int newRows = Array.IndexOf(args, "--rows") is int r and >= 0 ? int.Parse(args[r + 1], CultureInfo.InvariantCulture) : 100_000;
    int demoSeed = Array.IndexOf(args, "--seed") is int s and >= 0 ? int.Parse(args[s + 1], CultureInfo.InvariantCulture) : 7;
    Foldwise.Bench.Predict.FoldModelCost.Run(fits, newRows, demoSeed);
    return;
}

var options = Options.Parse(args);
string work = Path.Combine(Path.GetTempPath(), "foldwise-bench-predict-" + Environment.ProcessId);
Directory.CreateDirectory(work);
try
{
    Console.WriteLine($"machine   {Environment.ProcessorCount} cores; load {Load()}");
    string rows = options.Csv is { } csv && File.Exists(csv) ? csv : WriteRows(options.Csv ?? Path.Combine(work, "new-rows.csv"), options);
    Console.WriteLine($"rows      {rows}: {new FileInfo(rows).Length / 1e6:F0} MB");
    string models = Path.Combine(Path.GetDirectoryName(Path.GetFullPath(options.Store))!, "models");
    if (Directory.Exists(models))
    {
        var files = Directory.GetFiles(models, "*.fwm");
        Console.WriteLine($"models    {files.Length} kept files, {files.Sum(f => new FileInfo(f).Length) / 1e6:F2} MB: " +
                          string.Join(", ", files.Select(f => $"{new FileInfo(f).Length / 1e6:F2} MB")));
    }

    Console.WriteLine();
    Console.WriteLine("run threads    read prepare   score   write   total | encode predict (summed over threads) | peak MB  load (1, 5, 15 min)");
    string? first = null;
    int run = 0;
    foreach (int threads in options.Threads)
    {
        for (int i = 0; i < options.Runs; i++)
        {
            run++;
            string output = Path.Combine(work, $"scored-{run}.csv");
            var s = KeptScoring.Predict(options.Store, rows, output, threads);
            string same = first is null ? "first" : $"{LargestRelativeDifference(first, output):G3}";
            Console.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"{run,3} {threads,7} {Sec(s.Read)} {Sec(s.Prepare)} {Sec(s.Score)} {Sec(s.Write)} {Sec(s.Took)} | {Sec(s.Work.Encode)} {Sec(s.Work.Predict)}" +
                $"                       | {Process.GetCurrentProcess().PeakWorkingSet64 / 1e6,7:F0}  {Load()}  vs run 1: {same}"));
            if (run == 1)
            {
                string members = string.Join(", ", s.Kept.Members.Select(m => $"trial {m.TrialId} {m.Family} {m.Weight:F3}"));
                Console.WriteLine($"          {s.Rows:N0} rows scored by {s.Work.Members} member(s) x {s.Work.Folds} folds ({members}), {s.Work.Threads} at a time");
            }

            first ??= output;
        }
    }
}
finally
{
    Directory.Delete(work, recursive: true);
}

static string WriteRows(string path, Options options)
{
    var watch = Stopwatch.StartNew();
    var table = FreightDemo.NewRows(DemoSize.Full, options.Seed, options.Rows);
    DemoCsvWriter.Write(table, path, FreightDemo.IdColumn, targetColumn: null);
    Console.WriteLine($"wrote     {table.RowCount:N0} new rows x {table.FeatureCount:N0} columns + {table.CategoryNames.Length} text columns ({table.Density:P1} non-zero) in {watch.Elapsed.TotalSeconds:F1} s");
    return path;
}

// The largest relative difference between two prediction files' values, row by row.
static double LargestRelativeDifference(string a, string b) =>
    File.ReadLines(a).Skip(1).Zip(File.ReadLines(b).Skip(1)).Max(pair =>
    {
        double x = double.Parse(pair.First.Split(',')[1], CultureInfo.InvariantCulture);
        double y = double.Parse(pair.Second.Split(',')[1], CultureInfo.InvariantCulture);
        return Math.Abs(x - y) / Math.Max(Math.Abs(x), double.Epsilon);
    });

static string Sec(TimeSpan t) => t.TotalSeconds.ToString("F2", CultureInfo.InvariantCulture).PadLeft(7);

static string Load() => File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "n/a";

internal sealed record Options(string Store, int Rows, int Seed, int[] Threads, int Runs, string? Csv)
{
    public static Options Parse(string[] args)
    {
        string? Value(string name) => Array.IndexOf(args, name) is int i and >= 0 && i + 1 < args.Length ? args[i + 1] : null;
        string store = Value("--store") ?? throw new ArgumentException("--store OUT/search.db is required");
        return new Options(
            store,
            int.Parse(Value("--rows") ?? "100000", CultureInfo.InvariantCulture),
            int.Parse(Value("--seed") ?? "7", CultureInfo.InvariantCulture),
            [.. (Value("--threads") ?? Environment.ProcessorCount.ToString(CultureInfo.InvariantCulture)).Split(',').Select(t => int.Parse(t, CultureInfo.InvariantCulture))],
            int.Parse(Value("--runs") ?? "1", CultureInfo.InvariantCulture),
            Value("--csv"));
    }
}
