using System.Diagnostics;
using System.Globalization;
using Foldwise.Bench.Rows;

// Usage: Foldwise.Bench.Rows --out DIR [--rows 1000000] [--test-rows 200000] [--columns 40] [--density 0.3]
//        [--rounds 25] [--trials 2]
// Writes DIR/train.csv, DIR/test.csv and DIR/search.json (LightGBM only, every trial at --rounds), for
//   /usr/bin/time -v foldwise run DIR/search.json --out DIR/run
// which measures read time, store size, peak memory and seconds per trial on a table of millions of rows.
string Option(string name, string fallback)
{
    int at = Array.IndexOf(args, name);
    return at >= 0 && at + 1 < args.Length ? args[at + 1] : fallback;
}

string outDir = Option("--out", "");
if (outDir.Length == 0)
{
    Console.Error.WriteLine("--out DIR is required");
    return 1;
}

int rows = int.Parse(Option("--rows", "1000000"), CultureInfo.InvariantCulture);
int testRows = int.Parse(Option("--test-rows", (rows / 5).ToString(CultureInfo.InvariantCulture)), CultureInfo.InvariantCulture);
int columns = int.Parse(Option("--columns", "40"), CultureInfo.InvariantCulture);
double density = double.Parse(Option("--density", "0.3"), CultureInfo.InvariantCulture);
int rounds = int.Parse(Option("--rounds", "25"), CultureInfo.InvariantCulture);
int trials = int.Parse(Option("--trials", "2"), CultureInfo.InvariantCulture);

Directory.CreateDirectory(outDir);
var watch = Stopwatch.StartNew();
TallCsvWriter.Write(Path.Combine(outDir, "train.csv"), "m", rows, columns, density, withTarget: true, seed: 11);
TallCsvWriter.Write(Path.Combine(outDir, "test.csv"), "n", testRows, columns, density, withTarget: false, seed: 12);
File.WriteAllText(Path.Combine(outDir, "search.json"), $$"""
{
  "name": "tall-{{rows}}",
  "data": { "train": "train.csv", "test": "test.csv", "id": "row_id", "target": "amount" },
  "metric": "rmsle",
  "folds": 5,
  "seed": 3,
  "families": { "lightgbm": {} },
  "schedule": { "kind": "full", "proposer": "random", "first_rung": {{rounds}}, "full_budget": {{rounds}}, "eta": 3 },
  "budget": { "trials": {{trials}} },
  "blend": { "mode": "simplex", "pool": {{trials}} }
}
""");
long bytes = new FileInfo(Path.Combine(outDir, "train.csv")).Length;
Console.WriteLine($"wrote {outDir}: train {rows:N0} × {columns} ({bytes / 1e6:F0} MB), test {testRows:N0} rows, {density:P0} non-zero, in {watch.Elapsed.TotalSeconds:F1} s");
return 0;
