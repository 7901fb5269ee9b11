using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;

namespace Foldwise.Bench.WholeSearch;

/// <summary>Runs the searches in turn as child processes and prints the load before each and their results side by side at the end.</summary>
internal static class Driver
{
    public static int Run(string[] args)
    {
        string[] runs = Value(args, "--runs", "before,after,before,after").Split(',');
        string hours = Value(args, "--hours", "0.1");
        string seed = Value(args, "--seed", "7");
        string families = Value(args, "--families", "default");
        string outRoot = Path.GetFullPath(Value(args, "--out", Path.Combine("bench", "results", "whole-search")));
        string csv = Value(args, "--csv", "");
        _ = CsvTable.Parse(csv);
        var choices = runs.Select(r => RunChoice.Parse(r, families)).ToList();

        Console.WriteLine($"whole-search bench: {hours} h per search, seed {seed}, families {families}, csv {(csv.Length > 0 ? csv : "none")}, {Environment.ProcessorCount} cores, runs {string.Join(" ", choices.Select(c => c.Name))}; {DateTimeOffset.UtcNow:yyyy-MM-dd HH:mm} UTC");
        var results = new List<string>();
        for (int i = 0; i < runs.Length; i++)
        {
            string outDir = Path.Combine(outRoot, $"{DateTimeOffset.UtcNow:yyyyMMddHHmmss}-{i + 1}-{choices[i].Name.Replace('/', '-')}");
            Console.WriteLine($"run {i + 1} ({choices[i].Name}), load before: {Load()}");
            var (code, result) = RunChild(choices[i], hours, seed, csv, outDir);
            results.Add($"run {i + 1}: {result ?? $"{choices[i].Name} failed, exit {code}"}; load after {Load()}");
        }

        results.ForEach(Console.WriteLine);
        return 0;
    }

    private static (int Code, string? Result) RunChild(RunChoice run, string hours, string seed, string csv, string outDir)
    {
        var info = new ProcessStartInfo(Environment.ProcessPath!) { RedirectStandardOutput = true, UseShellExecute = false };
        if (Path.GetFileNameWithoutExtension(Environment.ProcessPath) == "dotnet")
        {
            info.ArgumentList.Add(typeof(Driver).Assembly.Location);
        }

        foreach (string arg in new[] { "--child", run.Name, hours, seed, csv, outDir })
        {
            info.ArgumentList.Add(arg);
        }

        info.Environment.Remove("OMP_WAIT_POLICY");
        if (run.Setting.WaitPolicy is { } policy)
        {
            info.Environment["OMP_WAIT_POLICY"] = policy;
        }

        using var child = Process.Start(info)!;
        // Stopping the driver stops its child too: SIGTERM passed on, so a search is never left running alone.
        using var onTerm = PosixSignalRegistration.Create(PosixSignal.SIGTERM, _ =>
        {
            if (!child.HasExited)
            {
                Process.Start("kill", ["-TERM", child.Id.ToString(CultureInfo.InvariantCulture)])?.WaitForExit();
            }
        });
        string? result = null;
        while (child.StandardOutput.ReadLine() is { } line)
        {
            Console.WriteLine(line);
            if (line.StartsWith("RESULT ", StringComparison.Ordinal))
            {
                result = line[7..];
            }
        }

        child.WaitForExit();
        return (child.ExitCode, result);
    }

    private static string Value(string[] args, string name, string fallback)
    {
        int i = Array.IndexOf(args, name);
        return i >= 0 && i + 1 < args.Length ? args[i + 1] : fallback;
    }

    private static string Load() => File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "n/a";
}
