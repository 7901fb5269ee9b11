using System.Diagnostics;
using System.Globalization;
using System.Runtime.InteropServices;
using Foldwise.Cli.Commands;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Tuning;

namespace Foldwise.Bench.WholeSearch;

/// <summary>
/// One whole search in this process, composed as <c>foldwise demo</c> composes it (the full-size demo's tables, or a
/// CSV pair, and the demo's definition with the run's schedule and families written to a folder, read back, then <see cref="SearchRun"/>: embedded coordinator, local slots,
/// store, blend, kept models), with the budget in hours only and the setting's slots, threads and learners.
/// </summary>
internal static class OneSearch
{
    public static async Task<int> RunAsync(RunChoice run, double hours, int seed, CsvTable? csv, string outDir)
    {
        var setting = run.Setting;
        Console.WriteLine($"{run.Name}: {setting.Description}; OMP_WAIT_POLICY={Environment.GetEnvironmentVariable("OMP_WAIT_POLICY") ?? "(unset)"}");
        var clock = Stopwatch.StartNew();
        Directory.CreateDirectory(outDir);
        var demo = DemoDefinition.For(quick: false, seed);
        string shape;
        if (run.Table == "csv")
        {
            var table = csv ?? throw new ArgumentException($"run '{run.Name}' reads the csv table: give --csv TRAIN,TEST,ID,TARGET");
            demo = demo with { Name = Path.GetFileNameWithoutExtension(table.Train), Data = new DataSource(table.Train, table.Test, table.IdColumn, table.TargetColumn) };
            shape = $"{table.Train} and {table.Test}, target {table.TargetColumn}";
        }
        else
        {
            var (train, test) = FreightDemo.Generate(DemoSize.Full, seed);
            DemoCsvWriter.Write(train, Path.Combine(outDir, "train.csv"), DemoDefinition.IdColumn, DemoDefinition.TargetColumn);
            DemoCsvWriter.Write(test, Path.Combine(outDir, "test.csv"), DemoDefinition.IdColumn, null);
            shape = $"demo written in {clock.Elapsed.TotalSeconds:F1} s: {train.RowCount:N0} x {train.FeatureCount:N0}, test {test.RowCount:N0} rows";
        }

        demo = demo with
        {
            Families = run.FamiliesFor(demo.Families),
            Schedule = run.ScheduleFor(demo.Schedule),
            Budget = new SearchBudget(Trials: null, Hours: hours),
        };
        string definitionPath = Path.Combine(outDir, "search.json");
        File.WriteAllText(definitionPath, DefinitionWriter.Write(demo));
        var definition = DefinitionReader.Read(definitionPath);
        var s = definition.Schedule;
        Console.WriteLine($"  {shape}; families {string.Join(", ", definition.Families.Select(f => f.Family))}; " +
                          $"schedule {DefinitionWords.Of(s.Kind)} {DefinitionWords.Of(s.Proposer)} eta {s.Eta}{(s.ByFolds ? $", screen folds {s.ScreenFolds}" : "")}; {hours} h; seed {seed}");

        var tally = new EventTally();
        var search = new SearchRun(tally) { Learners = setting.Learners };
        // SIGTERM (the driver stopped, or a hand) abandons the search: running trials end, nothing is blended.
        using var abandon = new CancellationTokenSource();
        using var onTerm = PosixSignalRegistration.Create(PosixSignal.SIGTERM, context =>
        {
            context.Cancel = true;
            abandon.Cancel();
        });
        var result = await search.RunNewAsync(definition, outDir, setting.Slots, setting.Threads, new SearchStopping(CancellationToken.None, abandon.Token));
        Summary.Print(run.Name, result, tally, definition);
        return result.Ending == SearchEnding.Blended ? 0 : 1;
    }
}
