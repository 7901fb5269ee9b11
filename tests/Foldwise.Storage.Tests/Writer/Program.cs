using System.Diagnostics;
using Foldwise.Storage;
using Foldwise.Storage.Writer;

// Usage:
//   loop <store> <count|forever> <oofLength> <testLength>
//       opens an existing store and saves trials (and their vectors) after the highest id present,
//       printing "saved <id>" once both calls returned; the tests read and kill this process.
//   bench <directory> [trials]
//       creates a store there and prints the time per call of Save, SaveVectors and LoadTrials
//       (with 500 trials unless told).
if (args.Length >= 5 && args[0] == "loop")
{
    using var store = SearchStore.Open(args[1]);
    int limit = args[2] == "forever" ? int.MaxValue : int.Parse(args[2]);
    int oofLength = int.Parse(args[3]);
    int testLength = int.Parse(args[4]);
    int first = store.LoadTrials().Select(t => t.Id).DefaultIfEmpty(0).Max() + 1;
    for (int n = 0; n < limit; n++)
    {
        int id = first + n;
        store.Save(SampleTrials.Done(id));
        store.SaveVectors(id, SampleTrials.Vector(oofLength, id), SampleTrials.Vector(testLength, -id));
        Console.Out.WriteLine($"saved {id}");
        Console.Out.Flush();
    }

    return 0;
}

if (args.Length >= 2 && args[0] == "bench")
{
    string path = StoreFile.PathIn(args[1]);
    int trials = args.Length > 2 ? int.Parse(args[2]) : 500;
    using var store = SearchStore.Create(path);
    Time("Save(TrialRecord), new id", trials, i => store.Save(SampleTrials.Done(i + 1)));
    Time("Save(TrialRecord), replace", trials, i => store.Save(SampleTrials.Done(i + 1) with { Attempt = 3 }));
    var oof = SampleTrials.Vector(50_000, 1);
    var test = SampleTrials.Vector(450_000, 2);
    Time("SaveVectors 50k + 0", 50, i => store.SaveVectors(i + 1, oof, []));
    Time("SaveVectors 50k + 450k, new id", 20, i => store.SaveVectors(1000 + i, oof, test));
    Time("SaveVectors 50k + 450k, replace", 20, i => store.SaveVectors(1000 + i, oof, test));
    Time("LoadVectors 50k + 450k", 20, i => store.LoadVectors(1000 + i));
    using var reader = SearchStore.OpenReadOnly(path);
    Time($"LoadTrials ({trials + 1} trials), read-only instance", 20, _ => reader.LoadTrials());
    Time("LoadTrial(id), read-only instance", 200, i => reader.LoadTrial(i + 1));
    WriterWaitsWhileReading(store, reader, trials);
    Console.WriteLine($"file size: {new FileInfo(path).Length / 1e6:F1} MB");
    return 0;
}

Console.Error.WriteLine("usage: loop <store> <count|forever> <oofLength> <testLength> | bench <directory> [trials]");
return 2;

static void Time(string what, int repeats, Action<int> action)
{
    action(0); // warm-up: JIT and first file open
    var watch = Stopwatch.StartNew();
    for (int i = 1; i <= repeats; i++)
    {
        action(i);
    }

    Console.WriteLine($"{what,-45} {watch.Elapsed.TotalMilliseconds / repeats,8:F2} ms/call  ({repeats} calls)");
}

// How long the coordinator's Save waits while another instance (as `history` would) reads every trial in a loop.
static void WriterWaitsWhileReading(SearchStore writer, SearchStore reader, int trials)
{
    using var stop = new CancellationTokenSource();
    int reads = 0;
    var reading = Task.Run(() =>
    {
        while (!stop.IsCancellationRequested)
        {
            reader.LoadTrials();
            reads++;
        }
    });
    var latencies = new List<double>();
    for (int i = 1; i <= 200; i++)
    {
        var watch = Stopwatch.StartNew();
        writer.Save(SampleTrials.Done(i) with { Attempt = 4 });
        latencies.Add(watch.Elapsed.TotalMilliseconds);
    }

    stop.Cancel();
    reading.Wait();
    latencies.Sort();
    Console.WriteLine(
        $"Save while LoadTrials ({trials + 1}) loops ({reads} reads): median {latencies[100]:F2} ms, " +
        $"p95 {latencies[189]:F2} ms, max {latencies[^1]:F2} ms");
}

