using Foldwise.Core.Search;
// ASHA+TPE against random search at full budget, on the invented freight demo, driven through the real
// coordinator and schedules with one slot (no Orleans: decisions and fits only). Reports, per seed, the
// fraction of compute (boosting rounds × training rows, summed over trials) that ASHA+TPE needed to reach
// random search's best out-of-fold RMSLE, and the median over seeds.
//
// Every trial is written to a trace file (bench/results/search/), so the two searches can run as two processes
// side by side (--part random / --part asha, one thread each: ML.NET trains one LightGBM model per process at a
// time) and be compared afterwards (--part report). A random trace already on disk for the same table, family,
// budget and seed is reused instead of being recomputed (fits are deterministic for a seed). --proposer random runs
// the schedule with random candidates instead of TPE's: a control that separates the schedule's saving from the proposer's.
// The scheduled search draws from seed + --draw-offset (default 1000), the same folds: its draws independent of random
// search's. --draw-offset 0 reproduces the older traces, where ASHA's random start-up candidates were random search's
// own first draws and matched its best at the schedule's floor whenever that came early.
using System.Globalization;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Csv;

var options = BenchArgs.Parse(args);
Directory.CreateDirectory(options.Out);
if (options.Part != "report")
{
    var (rawTrain, rawTest) = options.Csv is { } csv ? ReadCsv(csv) : FreightDemo.Generate(options.Size, seed: 7);
    var report = ColumnScreen.Screen(rawTrain, new ScreeningOptions());
    var train = ColumnScreen.Apply(report, rawTrain);
    var test = ColumnScreen.Apply(report, rawTest);
    Console.WriteLine($"table {options.TableLabel}: {train.RowCount} × {train.FeatureCount} after screening; family {options.Family}; " +
                      $"{DefinitionWords.Of(options.Schedule)} rounds {options.FirstRung}..{options.FullBudget}, eta {options.Eta}, rate exponent {options.RateExponent}, screen {options.Screen}{(options.ByFolds ? $" from {options.FirstFolds} of {BenchArgs.FoldCount} folds" : "")}, proposer {options.ProposerLabel}, brackets {options.Brackets}; random {options.RandomTrials} trials at {options.FullBudget}; {options.Threads} threads");

    // Test predictions are part of every trial but not of the comparison: a 50-row test slice keeps them cheap
    // (a CSV table's test file is given small instead: its category columns are aligned with the whole test table).
    double randomCompute = (double)options.RandomTrials * options.FullBudget * train.RowCount;
    foreach (int seed in options.SeedList)
    {
        var metric = Metric.Rmsle;
        var folds = StratifiedFoldPlanner.Create([.. train.Target.Select(metric.Forward)], BenchArgs.FoldCount, new SearchSeeds(seed).FoldPlan);
        var whole = TrialData.From(train, test, folds, metric);
        var data = options.Csv is not null ? whole : TestSlice.First(whole, 50);
        string randomPath = Path.Combine(options.Out, options.RandomFile(seed));
        var random = Trace.ReadIfComplete(randomPath, options.RandomTrials);
        if (options.Part == "costs")
        {
            Costs.Run(TrialData.From(train, test, folds, metric), options, seed, candidates: 3);
            continue;
        }

        if (options.Part == "probe")
        {
            Probe.Run(data, options, random ?? throw new InvalidOperationException($"--part probe needs the random trace {randomPath}"), seed, options.ProbeBudget, options.ProbeExponents);
            continue;
        }

        if (options.Part is "both" or "random" && random is null)
        {
            random = SearchRun.Run(data, options, ScheduleKind.Full, ProposerKind.Random, options.RandomTrials, seed, stopBelow: double.NegativeInfinity, computeCap: double.PositiveInfinity);
            Trace.Write(randomPath, random);
            Console.WriteLine($"seed {seed}: random search best {random[^1].Best:F5} after {random.Count} trials, {random.Sum(r => r.Seconds):F0} s → {randomPath}");
        }

        if (options.Part is "both" or "asha")
        {
            // Without random's result at hand (the searches running side by side) ASHA+TPE runs to the compute cap.
            double stopBelow = random is null ? double.NegativeInfinity : random[^1].Best;
            // Capped at random search's own compute: rounds actually trained when its trials stop early.
            var asha = SearchRun.Run(data, options, options.Schedule, options.Proposer, options.AshaTrials, seed + options.DrawOffset, stopBelow, computeCap: random?[^1].Compute ?? randomCompute);
            string ashaPath = Path.Combine(options.Out, options.AshaFile(seed));
            Trace.Write(ashaPath, asha);
            Console.WriteLine($"seed {seed}: {DefinitionWords.Of(options.Schedule)} ({options.ProposerLabel}) best {asha[^1].Best:F5} after {asha.Count} trials ({asha.Count(r => r.Budget == options.TopBudget)} at {options.TopBudget} {(options.ByFolds ? "folds" : "rounds")}), {asha.Sum(r => r.Seconds):F0} s → {ashaPath}");
        }
    }
}

if (options.Part is not ("probe" or "costs"))
{
    Comparison.Print(options);
}

static (Foldwise.Core.Data.FeatureTable Train, Foldwise.Core.Data.FeatureTable Test) ReadCsv(CsvPair csv)
{
    var train = CsvTableReader.ReadTraining(csv.Train, csv.Id, csv.Target, Metric.Rmsle);
    return (train, CsvTableReader.ReadTest(csv.Test, csv.Id, csv.Target, Foldwise.Core.Data.TableRules.Default, train));
}
