using Foldwise.Bench.Cluster;

string mode = args.Length > 0 ? args[0] : "simulate";
return mode switch
{
    "simulate" => SlotSimulation.Run(slots: 256, trials: args.Length > 1 && int.TryParse(args[1], out int n) ? n : 4096, tpe: args.Contains("--tpe"), backups: !args.Contains("--no-backups")),
    "memory" => QueueMemory.Run(),
    "processes" => await ProcessUtilisation.RunAsync(args.Length > 1 ? args[1] : "src/Foldwise.Cli/bin/Release/net10.0/foldwise.dll"),
    _ => Usage(),
};

static int Usage()
{
    Console.Error.WriteLine("usage: simulate [TRIALS] [--tpe] [--no-backups] | memory | processes [FOLDWISE_DLL]");
    return 2;
}
