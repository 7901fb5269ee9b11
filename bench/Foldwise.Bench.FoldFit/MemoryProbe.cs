using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Csv;
using Foldwise.Learners;

namespace Foldwise.Bench.FoldFit;

/// <summary>
/// Where a worker's memory goes: reads a CSV pair as a worker holds it (<see cref="TrialData"/>), then runs LightGBM
/// trials in <c>--slots</c> loops side by side, as a worker's slots do, and prints at each step the process's resident
/// memory (now and its peak, from /proc/self/status) beside the managed heap (GC), so what LightGBM holds natively is
/// the difference. Command line: <c>--memory --train F --test F [--target amount] [--id row_id] [--slots 2]
/// [--trials 2] [--rounds 25] [--trim]</c>; <c>--steps [--extra "key=value ..."]</c> instead takes one fold's native
/// steps (Datasets, booster, a round) one at a time on LightGBM's C API directly, for two folds in turn.
/// </summary>
internal static class MemoryProbe
{
    public static int Run(string[] args)
    {
        string train = Value(args, "--train", "");
        string test = Value(args, "--test", "");
        int slots = int.Parse(Value(args, "--slots", "2"), CultureInfo.InvariantCulture);
        int trials = int.Parse(Value(args, "--trials", "2"), CultureInfo.InvariantCulture);
        int rounds = int.Parse(Value(args, "--rounds", "25"), CultureInfo.InvariantCulture);
        Trim = args.Contains("--trim");
        bool asDrawn = args.Contains("--as-drawn");
        var clock = Stopwatch.StartNew();
        Print(clock, "start");
        var metric = Metric.Rmsle;
        var trainTable = CsvTableReader.ReadTraining(train, Value(args, "--id", "row_id"), Value(args, "--target", "amount"), metric);
        var testTable = CsvTableReader.ReadTest(test, Value(args, "--id", "row_id"), null, Foldwise.Core.Data.TableRules.Default, trainTable);
        Print(clock, $"read {trainTable.RowCount:N0} x {trainTable.FeatureCount} and {testTable.RowCount:N0} test rows");
        var data = TrialData.From(trainTable, testTable, SeededKFold.Plan(trainTable.RowCount, 5, 3), metric);
        Print(clock, "trial data built (rows form)");
        trainTable = null;
        testTable = null;
        GC.Collect();
        Print(clock, "tables let go, collected");
        if (args.Contains("--aggressive"))
        {
            GC.Collect(2, GCCollectionMode.Aggressive, blocking: true, compacting: true);
            Print(clock, "aggressive collection");
        }

        if (args.Contains("--steps"))
        {
            string extra = Value(args, "--extra", "");
            for (int repeat = 0; repeat < 2; repeat++)
            {
                BareLightGbm.Steps(data, repeat, BareLightGbm.Parameters(Parameters(repeat), 7, 1) + " " + extra, step => Print(clock, $"fold {repeat}: {step}"));
            }

            return 0;
        }

        // Every trial is a new candidate (its own min_leaf_rows), so none borrows another's binned fold rows.
        // --as-drawn: the two candidates the 1,000,000-row search of bench/Foldwise.Bench.Rows draws (seed 3).
        Dictionary<string, double> Parameters(int trial) => asDrawn && trial % 2 == 0
            ? new() { ["learning_rate"] = 0.01436, ["leaves"] = 112, ["min_leaf_rows"] = 55, ["feature_fraction"] = 0.9703, ["row_fraction"] = 0.9934, ["l2"] = 0.4632 }
            : asDrawn
            ? new() { ["learning_rate"] = 0.01127, ["leaves"] = 77, ["min_leaf_rows"] = 80, ["feature_fraction"] = 0.7752, ["row_fraction"] = 0.5344, ["l2"] = 0.03531 }
            : new() { ["learning_rate"] = 0.1, ["leaves"] = 31, ["min_leaf_rows"] = 20 + trial, ["feature_fraction"] = 0.8, ["row_fraction"] = 0.8, ["l2"] = 1 };
        var seconds = new double[trials];
        Parallel.For(0, slots, new ParallelOptions { MaxDegreeOfParallelism = slots }, slot =>
        {
            for (int t = slot; t < trials; t += slots)
            {
                var lap = Stopwatch.StartNew();
                var outcome = new TrialExecutor(new LightGbmLearner()).Run(
                    data, ParameterSet.Of(Parameters(t)), rounds, 7 + t, 1, CancellationToken.None,
                    advanced: (ready, round) =>
                    {
                        if (round == 0 || round == 1 || round == rounds)
                        {
                            Print(clock, $"slot {slot} trial {t}: {ready} fold(s) ready, round {round}");
                        }
                    });
                seconds[t] = lap.Elapsed.TotalSeconds;
                Print(clock, $"slot {slot} trial {t} done in {seconds[t]:F1} s, OOF RMSLE {outcome.Score:R}, predictions {Fingerprint(outcome)}");
            }
        });
        GC.Collect();
        Print(clock, "all trials done, collected");
        return 0;
    }

    /// <summary>Also prints each step after glibc's malloc_trim, which returns freed native memory to the system: what stays is in use.</summary>
    private static bool Trim { get; set; }

    [System.Runtime.InteropServices.DllImport("libc", EntryPoint = "malloc_trim")]
    private static extern int MallocTrim(nuint pad);

    private static void Print(Stopwatch clock, string what)
    {
        if (Trim)
        {
            Print1(clock, what);
            what += $" [after malloc_trim: {MallocTrim(0)}]";
        }

        Print1(clock, what);
    }

    private static void Print1(Stopwatch clock, string what)
    {
        var status = File.ReadAllLines("/proc/self/status");
        string Kb(string key) => status.First(l => l.StartsWith(key, StringComparison.Ordinal)).Split(':')[1].Trim().Split(' ')[0];
        double rss = double.Parse(Kb("VmRSS"), CultureInfo.InvariantCulture) / 1e6;
        double peak = double.Parse(Kb("VmHWM"), CultureInfo.InvariantCulture) / 1e6;
        var gc = GC.GetGCMemoryInfo();
        Console.WriteLine(string.Create(
            CultureInfo.InvariantCulture,
            $"{clock.Elapsed.TotalSeconds,7:F1} s  rss {rss:F2} GB (peak {peak:F2})  managed heap {GC.GetTotalMemory(false) / 1e9:F2} GB (committed at the last collection {gc.TotalCommittedBytes / 1e9:F2} GB)  | {what}"));
    }

    /// <summary>The first 12 hex digits of the SHA-256 of the out-of-fold and test predictions' bits: equal only when every prediction is.</summary>
    private static string Fingerprint(TrialOutcome outcome)
    {
        var bytes = System.Runtime.InteropServices.MemoryMarshal.AsBytes(outcome.OutOfFold.Concat(outcome.Test).ToArray().AsSpan());
        return Convert.ToHexStringLower(System.Security.Cryptography.SHA256.HashData(bytes))[..12];
    }

    private static string Value(string[] args, string name, string fallback)
    {
        int i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : fallback;
    }
}
