using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Data;
using Foldwise.Core.Demo;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

namespace Foldwise.Bench.FoldFit;

/// <summary>
/// Trials per hour on this machine's cores, one configuration per child process (so OpenMP settings and LightGBM's
/// process-wide thread count never leak between them), configurations interleaved within each repetition so the
/// load of a shared machine hits them alike:
/// <list type="bullet">
/// <item><c>old</c>: the former default, ML.NET's trainer in one slot with 2 threads, OMP_WAIT_POLICY=passive;</item>
/// <item><c>new</c>: the default, the native learner through <see cref="TrialExecutor"/> in 2 slots of 1 thread in one process;</item>
/// <item><c>bare</c>: two single-threaded fold loops straight on LightGBM's C API, side by side in one process;</item>
/// <item><c>wide</c>: the native learner in one slot with 2 threads (what <c>--threads 2 --slots 1</c> gives);</item>
/// <item><c>fixed</c>: <c>bare</c> with no rounds: Datasets, boosters and predictions only, the most a cache of fold Datasets could save.</item>
/// </list>
/// Command line: <c>--pair [--table small|demo|rowsN] [--rounds R] [--reps 3] [--trials 4] [--modes old,new,bare]</c>.
/// </summary>
internal static class PairBench
{
    public static int Run(string[] args)
    {
        string table = Value(args, "--table", "small");
        int reps = int.Parse(Value(args, "--reps", "3"), CultureInfo.InvariantCulture);
        int trials = int.Parse(Value(args, "--trials", "4"), CultureInfo.InvariantCulture);
        string rounds = Value(args, "--rounds", table == "demo" ? "200" : "400");
        string[] modes = Value(args, "--modes", "old,new,bare").Split(',');
        Console.WriteLine($"pair bench: table {table}, {rounds} rounds, 5 folds, {trials} trials per configuration and repetition, {Environment.ProcessorCount} cores; load before: {Load()}");
        var perHour = modes.ToDictionary(m => m, _ => new List<double>());
        for (int rep = 1; rep <= reps; rep++)
        {
            var line = new List<string>();
            foreach (string mode in modes)
            {
                double seconds = RunChild(mode, table, rounds, trials);
                perHour[mode].Add(trials * 3600 / seconds);
                line.Add($"{mode} {trials * 3600 / seconds,6:F0}/h ({seconds / trials,5:F1} s per trial)");
            }

            Console.WriteLine($"rep {rep}: {string.Join(" | ", line)}; load {Load()}");
        }

        Console.WriteLine("median trials per hour: " + string.Join(", ", modes.Select(m => $"{m} {Median(perHour[m]):F0}")));
        if (perHour.TryGetValue("bare", out var bare))
        {
            foreach (string mode in modes.Where(m => m != "bare"))
            {
                var ratios = bare.Zip(perHour[mode], (b, x) => b / x).ToList();
                Console.WriteLine($"bare / {mode} per repetition: {string.Join(" ", ratios.Select(r => r.ToString("F2", CultureInfo.InvariantCulture)))} (median {Median(ratios):F2})");
            }
        }

        return 0;
    }

    /// <summary>In the child: builds the table, then times the trials only.</summary>
    public static int Child(string[] args)
    {
        string mode = args[1];
        string table = args[2];
        int rounds = int.Parse(args[3], CultureInfo.InvariantCulture);
        int trials = int.Parse(args[4], CultureInfo.InvariantCulture);
        var (train, test) = table switch
        {
            "demo" => FreightDemo.Generate(DemoSize.Full, 7),
            "small" => InventedTable.Generate(2000, 2000, 7),
            _ when table.StartsWith("rows", StringComparison.Ordinal) => InventedTable.Generate(int.Parse(table[4..], CultureInfo.InvariantCulture), 2000, 7),
            _ => throw new ArgumentException($"unknown table {table}"),
        };
        var data = TrialData.From(train, test, SeededKFold.Plan(train.RowCount, 5, 7), Metric.Rmsle);
        // Every trial is a new candidate: its own min_leaf_rows (so no trial borrows another's binned Datasets, as
        // in a search where promotions alone reuse them) and its whole budget (no round stopping), in every mode.
        Dictionary<string, double> Parameters(int seed) => new()
        {
            ["learning_rate"] = 0.05, ["leaves"] = 31, ["min_leaf_rows"] = 13 + seed, ["feature_fraction"] = 0.5, ["row_fraction"] = 0.8, ["l2"] = 1,
        };
        Action<int> trial = mode switch
        {
            "old" => seed => new TrialExecutor(new MlNetLightGbmLearner(), null).Run(data, ParameterSet.Of(Parameters(seed)), rounds, seed, 2, CancellationToken.None),
            "new" => seed => new TrialExecutor(new LightGbmLearner(), null).Run(data, ParameterSet.Of(Parameters(seed)), rounds, seed, 1, CancellationToken.None),
            "wide" => seed => new TrialExecutor(new LightGbmLearner(), null).Run(data, ParameterSet.Of(Parameters(seed)), rounds, seed, 2, CancellationToken.None),
            "bare" or "fixed" => seed =>
            {
                for (int f = 0; f < 5; f++)
                {
                    BareLightGbm.Fold(data, f, BareLightGbm.Parameters(Parameters(seed), seed + (1000 * f), 1), mode == "bare" ? rounds : 0);
                }
            },
            _ => throw new ArgumentException($"unknown mode {mode}"),
        };
        int loops = mode is "new" or "bare" or "fixed" ? 2 : 1;
        var clock = Stopwatch.StartNew();
        Parallel.For(0, loops, new ParallelOptions { MaxDegreeOfParallelism = loops }, loop =>
        {
            for (int t = loop; t < trials; t += loops)
            {
                trial(7 + t);
            }
        });
        Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"RESULT {clock.Elapsed.TotalSeconds:R}"));
        return 0;
    }

    private static double RunChild(string mode, string table, string rounds, int trials)
    {
        var info = new ProcessStartInfo(Environment.ProcessPath!) { RedirectStandardOutput = true, UseShellExecute = false };
        if (Path.GetFileNameWithoutExtension(Environment.ProcessPath) == "dotnet")
        {
            info.ArgumentList.Add(typeof(PairBench).Assembly.Location);
        }

        foreach (string arg in new[] { "--pair-child", mode, table, rounds, trials.ToString(CultureInfo.InvariantCulture) })
        {
            info.ArgumentList.Add(arg);
        }

        // The former default re-launched itself with a passive wait policy; the others run as the process starts.
        info.Environment.Remove("OMP_WAIT_POLICY");
        if (mode == "old")
        {
            info.Environment["OMP_WAIT_POLICY"] = "passive";
        }

        using var child = Process.Start(info)!;
        string output = child.StandardOutput.ReadToEnd();
        child.WaitForExit();
        string result = output.Split('\n').LastOrDefault(l => l.StartsWith("RESULT ", StringComparison.Ordinal))
            ?? throw new InvalidOperationException($"{mode} child failed (exit {child.ExitCode}): {output}");
        return double.Parse(result[7..], CultureInfo.InvariantCulture);
    }

    private static string Value(string[] args, string name, string fallback)
    {
        int i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : fallback;
    }

    private static double Median(List<double> values)
    {
        var sorted = values.Order().ToList();
        return sorted.Count % 2 == 1 ? sorted[sorted.Count / 2] : (sorted[(sorted.Count / 2) - 1] + sorted[sorted.Count / 2]) / 2;
    }

    private static string Load() => File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "n/a";
}
