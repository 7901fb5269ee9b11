using System.Globalization;
using Foldwise.Bench.WholeSearch;

// A whole search at one hours budget, in each run in turn, one child process per search (so the wait policy and
// LightGBM's process-wide state never carry over), the load average printed before each. A run is
// setting[/schedule[/families[/table]]] (RunChoice): before|after, asha|random|racing, default|all|FAMILY, demo|csv.
// Command line: [--runs before,after,before,after] [--hours 0.1] [--seed 7] [--families default|all|FAMILY] [--csv TRAIN,TEST,ID,TARGET] [--out DIR]
if (args.Length > 0 && args[0] == "--child")
{
    return await OneSearch.RunAsync(RunChoice.Parse(args[1], "default"), double.Parse(args[2], CultureInfo.InvariantCulture), int.Parse(args[3], CultureInfo.InvariantCulture), CsvTable.Parse(args[4]), args[5]);
}

return Driver.Run(args);
