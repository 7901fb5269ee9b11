using System.Diagnostics;
using System.Globalization;
using System.Net;
using System.Net.Sockets;
using System.Text;
using System.Text.Json.Nodes;

namespace Foldwise.Bench.Cluster;

/// <summary>
/// A coordinator process with no slots and two worker processes on loopback running a synthetic table
/// (invented data); utilisation = trial seconds / (slot time from each worker's first lease to the search's end).
/// </summary>
internal static class ProcessUtilisation
{
    public static async Task<int> RunAsync(string dll)
    {
        dll = Path.GetFullPath(dll);
        string root = Path.Combine(Path.GetTempPath(), "foldwise-bench-cluster", Guid.NewGuid().ToString("N"));
        Directory.CreateDirectory(root);
        WriteTables(root, rows: 3000);
        File.WriteAllText(Path.Combine(root, "search.json"), """
            { "name": "bench-cluster", "data": { "train": "train.csv", "test": "test.csv", "id": "id", "target": "y" },
              "folds": 3, "screening": { "min_nonzero": 2 }, "families": { "lightgbm": { "min_leaf_rows": 3 } },
              "schedule": { "kind": "asha", "proposer": "random", "first_rung": 300, "full_budget": 900, "eta": 3 },
              "budget": { "trials": 24 } }
            """);
        int port = FreePort();
        var clock = Stopwatch.StartNew();
        using var coordinator = Start(dll, "run", Path.Combine(root, "search.json"), "--out", Path.Combine(root, "out"), "--slots", "0", "--port", port.ToString(CultureInfo.InvariantCulture));
        await Task.Delay(4000);
        using var w1 = Start(dll, "worker", "--join", $"127.0.0.1:{port}", "--threads", "1", "--name", "w1", "--cache", Path.Combine(root, "c1"));
        using var w2 = Start(dll, "worker", "--join", $"127.0.0.1:{port}", "--threads", "1", "--name", "w2", "--cache", Path.Combine(root, "c2"));
        await coordinator.WaitForExitAsync();
        Console.WriteLine($"search exit {coordinator.ExitCode} after {clock.Elapsed.TotalSeconds:F0} s");
        w1.Kill();
        w2.Kill();
        using var history = Start(dll, "history", Path.Combine(root, "out", "search.db"), "--json");
        string json = await history.StandardOutput.ReadToEndAsync();
        await history.WaitForExitAsync();
        var trials = JsonNode.Parse(json[json.IndexOf('[', StringComparison.Ordinal)..])!.AsArray();
        DateTimeOffset end = trials.Max(t => (DateTimeOffset)t!["finished"]!);
        double busy = 0, available = 0;
        foreach (var group in trials.GroupBy(t => (string)t!["worker"]!))
        {
            double seconds = group.Sum(t => (double)t!["seconds"]!);
            var first = group.Min(t => (DateTimeOffset)t!["started"]!);
            double span = (end - first).TotalSeconds;
            Console.WriteLine($"  {group.Key}: {group.Count()} trials, busy {seconds:F1} s of {span:F1} s = {seconds / span:P1}");
            busy += seconds;
            available += span;
        }

        Console.WriteLine($"slot utilisation, two worker processes on loopback: {busy / available:P1} ({trials.Count} trials)");
        Directory.Delete(root, recursive: true);
        return 0;
    }

    private static Process Start(string dll, params string[] args)
    {
        var info = new ProcessStartInfo("dotnet") { UseShellExecute = false, RedirectStandardOutput = args[0] == "history" };
        info.ArgumentList.Add(dll);
        foreach (string a in args)
        {
            info.ArgumentList.Add(a);
        }

        if (args[0] != "history")
        {
            info.RedirectStandardOutput = true;
            var p = Process.Start(info)!;
            p.OutputDataReceived += (_, _) => { };
            p.BeginOutputReadLine();
            return p;
        }

        return Process.Start(info)!;
    }

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    private static void WriteTables(string root, int rows)
    {
        var random = new Random(5);
        var train = new StringBuilder("id,f1,f2,f3,f4,f5,y\n");
        for (int r = 0; r < rows; r++)
        {
            int f1 = random.Next(0, 4), f2 = random.Next(0, 3), f3 = random.Next(0, 2);
            double y = Math.Exp(1 + (0.6 * f1) + (0.4 * f2) + (0.1 * random.NextDouble()));
            train.Append(CultureInfo.InvariantCulture, $"a{r},{f1},{f2},{f3},1,{f1},{y:F3}\n");
        }

        var test = new StringBuilder("id,f1,f2,f3,f4,f5\n");
        for (int r = 0; r < 50; r++)
        {
            test.Append(CultureInfo.InvariantCulture, $"b{r},{r % 4},{r % 3},{r % 2},1,{r % 4}\n");
        }

        File.WriteAllText(Path.Combine(root, "train.csv"), train.ToString());
        File.WriteAllText(Path.Combine(root, "test.csv"), test.ToString());
    }
}
