using System.Globalization;
using Foldwise.Bench.WholeSearch;

// A whole search on the full-size demo at one hours budget, in each setting in turn, one child process per search
// (so the wait policy and LightGBM's process-wide state never carry over), the load average printed before each.
// Command line: [--runs before,after,before,after] [--hours 0.1] [--seed 7] [--families default|lightgbm|fasttree] [--out DIR]
if (args.Length > 0 && args[0] == "--child")
{
    return await OneSearch.RunAsync(Setting.Named(args[1]), double.Parse(args[2], CultureInfo.InvariantCulture), int.Parse(args[3], CultureInfo.InvariantCulture), args[4], args[5]);
}

return Driver.Run(args);
