using System.Diagnostics;
using System.Globalization;
using Foldwise.Cli.Commands;
using Foldwise.Core.Definition;
using Foldwise.Core.Demo;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Tuning;

namespace Foldwise.Bench.WholeSearch;

/// <summary>
/// One whole search in this process, composed as <c>foldwise demo</c> composes it (the full-size demo's tables and
/// definition written to a folder, read back, then <see cref="SearchRun"/>: embedded coordinator, local slots,
/// store, blend, kept models), with the budget in hours only and the setting's slots, threads and learners.
/// </summary>
internal static class OneSearch
{
    public static async Task<int> RunAsync(Setting setting, double hours, int seed, string families, string outDir)
    {
        Console.WriteLine($"{setting.Name}: {setting.Description}; OMP_WAIT_POLICY={Environment.GetEnvironmentVariable("OMP_WAIT_POLICY") ?? "(unset)"}");
        var clock = Stopwatch.StartNew();
        Directory.CreateDirectory(outDir);
        var (train, test) = FreightDemo.Generate(DemoSize.Full, seed);
        DemoCsvWriter.Write(train, Path.Combine(outDir, "train.csv"), DemoDefinition.IdColumn, DemoDefinition.TargetColumn);
        DemoCsvWriter.Write(test, Path.Combine(outDir, "test.csv"), DemoDefinition.IdColumn, null);
        var demo = DemoDefinition.For(quick: false, seed);
        demo = demo with
        {
            Families = families == "default" ? demo.Families : [.. demo.Families.Where(f => f.Family == families)],
            Budget = new SearchBudget(Trials: null, Hours: hours),
        };
        string definitionPath = Path.Combine(outDir, "search.json");
        File.WriteAllText(definitionPath, DefinitionWriter.Write(demo));
        var definition = DefinitionReader.Read(definitionPath);
        Console.WriteLine($"  demo written in {clock.Elapsed.TotalSeconds:F1} s: {train.RowCount:N0} x {train.FeatureCount:N0}, test {test.RowCount:N0} rows; " +
                          $"families {string.Join(", ", definition.Families.Select(f => f.Family))}; {hours} h; seed {seed}");

        var tally = new EventTally();
        var search = new SearchRun(tally) { Learners = setting.Learners };
        var result = await search.RunNewAsync(definition, outDir, setting.Slots, setting.Threads, SearchStopping.Never);
        Summary.Print(setting, result, tally, definition);
        return result.Ending == SearchEnding.Blended ? 0 : 1;
    }
}
