using System.Collections.Immutable;
using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Data;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;
using Foldwise.Csv;
using Foldwise.Bench.Tables;
using Foldwise.Learners;

// Two measurements of tables with categories and gaps:
//   read DIR                      — reading a 50,000-row table with 10 text columns against the same table numeric-coded
//   cv TRAIN.csv ID TARGET DIR    — two 5-fold LightGBM trials through TrialExecutor on the same folds (categories encoded
//                                   inside each fold), few-level columns as indicator columns and then as level codes;
//                                   writes DIR/folds.csv and DIR/foldwise_oof.csv (the indicator trial's) for bench/peers/category_peers.py
var invariant = CultureInfo.InvariantCulture;
switch (args.FirstOrDefault())
{
    case "read":
        Reading(args[1]);
        break;
    case "cv":
        CrossValidate(args[1], args[2], args[3], args[4], args.Length > 5 ? int.Parse(args[5], invariant) : 500);
        break;
    default:
        Console.WriteLine("usage: read DIR | cv TRAIN.csv ID TARGET DIR [ROUNDS]");
        break;
}

static void Reading(string directory)
{
    Directory.CreateDirectory(directory);
    string text = Path.Combine(directory, "text.csv");
    string coded = Path.Combine(directory, "coded.csv");
    TableWriter.Write(text, coded, rows: 50_000, textColumns: 10, numericColumns: 20, seed: 5);
    Console.WriteLine($"files: text {new FileInfo(text).Length / 1e6:F1} MB, numeric-coded {new FileInfo(coded).Length / 1e6:F1} MB");
    var textTimes = new List<double>();
    var codedTimes = new List<double>();
    FeatureTable? table = null;
    for (int run = 0; run < 4; run++)
    {
        // Alternating, so the shared machine's load hits both sides alike; the first pair warms up.
        var clock = Stopwatch.StartNew();
        table = CsvTableReader.ReadTest(text, "id", null);
        textTimes.Add(clock.Elapsed.TotalSeconds);
        clock.Restart();
        CsvTableReader.ReadTest(coded, "id", null);
        codedTimes.Add(clock.Elapsed.TotalSeconds);
    }

    double t = textTimes.Skip(1).Order().ElementAt(1);
    double c = codedTimes.Skip(1).Order().ElementAt(1);
    Console.WriteLine($"read seconds, text:  {string.Join(" ", textTimes.Select(s => s.ToString("F3", CultureInfo.InvariantCulture)))}");
    Console.WriteLine($"read seconds, coded: {string.Join(" ", codedTimes.Select(s => s.ToString("F3", CultureInfo.InvariantCulture)))}");
    Console.WriteLine($"median of runs 2-4: text {t:F3} s, numeric-coded {c:F3} s, ratio {t / c:F2}x");
    GC.Collect();
    long before = GC.GetTotalMemory(forceFullCollection: true);
    var kept = CsvTableReader.ReadTest(text, "id", null);
    long after = GC.GetTotalMemory(forceFullCollection: true);
    Console.WriteLine($"table with text columns: {kept.FeatureCount} numeric + {kept.CategoryNames.Length} category columns, " +
        $"{kept.Categories.Sum(k => k.Levels.Length)} levels; managed memory held {(after - before) / 1e6:F1} MB; encoded for shipping {TableCodec.Encode(kept).Length / 1e6:F1} MB");
    GC.KeepAlive(kept);
    GC.KeepAlive(table);
}

static void CrossValidate(string path, string id, string target, string directory, int rounds)
{
    var clock = Stopwatch.StartNew();
    var train = CsvTableReader.ReadTraining(path, id, target, Metric.Rmsle);
    Console.WriteLine($"read {train.RowCount} rows, {train.FeatureCount} numeric and {train.CategoryNames.Length} category columns ({string.Join(", ", train.CategoryNames)}) in {clock.Elapsed.TotalSeconds:F1} s");
    var folds = StratifiedFoldPlanner.Create([.. train.Target.Select(Metric.Rmsle.Forward)], 5, seed: 1);
    var data = TrialData.From(train, train, folds, Metric.Rmsle);
    var parameters = ParameterSet.Of(new Dictionary<string, double>
    {
        ["learning_rate"] = 0.05,
        ["leaves"] = 31,
        ["min_leaf_rows"] = 20,
        ["feature_fraction"] = 1,
        ["row_fraction"] = 1,
        ["l2"] = 0,
    });
    // Both forms of a few-level category column on the same folds and settings, one after the other.
    TrialOutcome? indicators = null;
    foreach (var (name, families) in new[] { ("indicator columns", ImmutableArray<string>.Empty), ("level codes, LightGBM's category splits", [FamilyNames.LightGbm]) })
    {
        clock.Restart();
        var outcome = new TrialExecutor(new LightGbmLearner()).Run(data with { LevelCodeFamilies = families }, parameters, rounds, seed: 1, threads: 1, CancellationToken.None);
        indicators ??= outcome;
        Console.WriteLine($"foldwise lightgbm, {name}: {rounds} rounds, lr 0.05, 31 leaves, 20 rows per leaf: OOF RMSLE {outcome.Score:F5} " +
            $"(folds {string.Join(" ", outcome.FoldScores.Select(s => s.ToString("F4", CultureInfo.InvariantCulture)))}) in {clock.Elapsed.TotalSeconds:F1} s");
    }

    var oof = indicators!;
    Directory.CreateDirectory(directory);
    File.WriteAllLines(Path.Combine(directory, "folds.csv"), ["id,fold", .. Enumerable.Range(0, train.RowCount).Select(r => $"{train.Ids[r]},{folds.FoldOfRow[r]}")]);
    File.WriteAllLines(Path.Combine(directory, "foldwise_oof.csv"), ["id,log1p_prediction", .. Enumerable.Range(0, train.RowCount).Select(r => $"{train.Ids[r]},{oof.OutOfFold[r].ToString("R", CultureInfo.InvariantCulture)}")]);
}
