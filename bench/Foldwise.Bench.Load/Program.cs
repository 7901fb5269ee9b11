using System.Diagnostics;
using Foldwise.Bench.Load;
using Foldwise.Csv;

// Usage: Foldwise.Bench.Load [rows] [columns] [density] [--keep]
// Defaults: 12,000 × 7,000 at 6 % non-zero, the size of the full demo's test table.
var numbers = args.Where(a => !a.StartsWith("--", StringComparison.Ordinal)).ToArray();
int rows = numbers.Length > 0 ? int.Parse(numbers[0]) : 12_000;
int columns = numbers.Length > 1 ? int.Parse(numbers[1]) : 7_000;
double density = numbers.Length > 2 ? double.Parse(numbers[2]) : 0.06;
bool keep = args.Contains("--keep");

string directory = Path.Combine(Path.GetTempPath(), "foldwise-bench-load-" + Environment.ProcessId);
Directory.CreateDirectory(directory);
string path = Path.Combine(directory, "test.csv");
try
{
    var watch = Stopwatch.StartNew();
    long written = SparseCsvWriter.Write(path, rows, columns, density, seed: 20240601);
    Console.WriteLine($"wrote     {path}: {new FileInfo(path).Length / 1e6:F1} MB, {written:N0} non-zero cells, {watch.Elapsed.TotalSeconds:F1} s");

    GC.Collect();
    long before = GC.GetTotalMemory(forceFullCollection: true);
    var cpuBefore = Process.GetCurrentProcess().TotalProcessorTime;
    watch.Restart();
    var table = CsvTableReader.ReadTest(path, "id", targetColumn: null);
    double seconds = watch.Elapsed.TotalSeconds;
    double cpuSeconds = (Process.GetCurrentProcess().TotalProcessorTime - cpuBefore).TotalSeconds;
    long nonZero = table.Columns.Sum(c => (long)c.NonZeroCount);
    long retained = GC.GetTotalMemory(forceFullCollection: true) - before;

    Console.WriteLine($"rows      {table.RowCount:N0}");
    Console.WriteLine($"columns   {table.FeatureCount:N0}");
    Console.WriteLine($"non-zeros {nonZero:N0} (density {table.Density:P2}){(nonZero == written ? string.Empty : $" MISMATCH: wrote {written:N0}")}");
    Console.WriteLine($"load      {seconds:F2} s wall, {cpuSeconds:F2} s CPU (all threads, GC included)");
    Console.WriteLine($"managed   {retained / 1e6:F1} MB held by the table after load, {GC.GetTotalAllocatedBytes() / 1e6:F0} MB allocated by the process in total");
    Console.WriteLine($"process   peak working set {Process.GetCurrentProcess().PeakWorkingSet64 / 1e6:F1} MB");
    GC.KeepAlive(table);
}
finally
{
    if (!keep)
    {
        Directory.Delete(directory, recursive: true);
    }
}
