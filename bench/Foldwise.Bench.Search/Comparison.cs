using System.Globalization;

/// <summary>
/// Reads the traces of the seeds asked for and prints, for random search after half and after all of its trials,
/// how much of its compute ASHA+TPE needed to reach the same best score; then the medians over seeds.
/// </summary>
internal static class Comparison
{
    public static void Print(BenchArgs options)
    {
        var c = CultureInfo.InvariantCulture;
        int[] targets = [options.RandomTrials / 2, options.RandomTrials];
        var fractions = targets.ToDictionary(t => t, _ => new List<double>());
        Console.WriteLine($"{options.Schedule} ({options.ProposerLabel}) rounds {options.Min}..{options.Max}, eta {options.Eta}, rate exponent {options.RateExponent} against random search at {options.Max} rounds; {options.Size} table, {options.Family}");
        Console.WriteLine("seed  random trials  random best  random compute  asha compute to reach  fraction  asha trials so far  asha best (trials, at max)");
        foreach (int seed in options.SeedList)
        {
            var random = Trace.ReadIfComplete(Path.Combine(options.Out, options.RandomFile(seed)), options.RandomTrials);
            var asha = Trace.Read(Path.Combine(options.Out, options.AshaFile(seed)));
            if (random is null || asha is null)
            {
                Console.WriteLine($"{seed,4}  (no {(random is null ? "random" : "asha")} trace yet)");
                continue;
            }

            string ashaBest = string.Create(c, $"{asha[^1].Best:F5} ({asha.Count}, {asha.Count(r => r.Budget == options.Max)})");
            foreach (int count in targets)
            {
                double target = random[count - 1].Best;
                double randomCompute = random[count - 1].Compute;
                int reachedAt = asha.FindIndex(s => s.Best <= target);
                double fraction = reachedAt < 0 ? double.PositiveInfinity : asha[reachedAt].Compute / randomCompute;
                fractions[count].Add(fraction);
                string reached = reachedAt < 0 ? "not reached" : asha[reachedAt].Compute.ToString("E3", c);
                string share = reachedAt < 0 ? "  >1" : fraction.ToString("P1", c);
                Console.WriteLine(string.Create(c,
                    $"{seed,4}  {count,13}  {target,11:F5}  {randomCompute,14:E3}  {reached,21}  {share,8}  {(reachedAt < 0 ? asha.Count : reachedAt + 1),18}  {ashaBest}"));
            }
        }

        foreach (int count in targets)
        {
            var list = fractions[count];
            if (list.Count == 0)
            {
                continue;
            }

            var sorted = list.Order().ToList();
            double median = sorted.Count % 2 == 1 ? sorted[sorted.Count / 2] : (sorted[(sorted.Count / 2) - 1] + sorted[sorted.Count / 2]) / 2;
            Console.WriteLine(string.Create(c,
                $"random {count} trials: median fraction of its compute that the scheduled search needed to match its best: {(double.IsInfinity(median) ? "not reached" : median.ToString("P1", c))} " +
                $"(seeds: {string.Join(", ", list.Select(f => double.IsInfinity(f) ? ">1" : f.ToString("P1", c)))}; aim: ≤ 25%)"));
        }
    }
}
