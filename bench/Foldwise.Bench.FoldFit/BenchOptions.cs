namespace Foldwise.Bench.FoldFit;

/// <summary>
/// Command line: <c>[--size full|quick] [--seed 7] [--rounds 200] [--threads 2] [--write DIR] [--fasttree] [--no-trial]</c>.
/// Defaults measure the Full demo with one 5-fold LightGBM trial.
/// </summary>
internal sealed record BenchOptions(string Size, int Seed, int Rounds, int Threads, string? WriteDirectory, bool FastTree, bool Trial)
{
    public static BenchOptions Parse(string[] args)
    {
        var options = new BenchOptions("full", 7, 200, 2, null, false, true);
        for (int i = 0; i < args.Length; i++)
        {
            string Next() => i + 1 < args.Length ? args[++i] : throw new ArgumentException($"{args[i]} needs a value");
            options = args[i] switch
            {
                "--size" => options with { Size = Next() },
                "--seed" => options with { Seed = int.Parse(Next()) },
                "--rounds" => options with { Rounds = int.Parse(Next()) },
                "--threads" => options with { Threads = int.Parse(Next()) },
                "--write" => options with { WriteDirectory = Next() },
                "--fasttree" => options with { FastTree = true },
                "--no-trial" => options with { Trial = false },
                _ => throw new ArgumentException($"unknown option {args[i]}"),
            };
        }

        return options;
    }
}
