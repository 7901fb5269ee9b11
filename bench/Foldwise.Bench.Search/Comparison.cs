using System.Globalization;
using Foldwise.Core.Definition;

/// <summary>
/// Reads the traces of the seeds asked for and prints, for random search after half and after all of its trials,
/// how much of its compute ASHA+TPE needed to reach the same best score; then the medians over seeds; then, at equal
/// compute (an eighth, a quarter, half and all of random search's), on how many seeds the scheduled search was ahead.
/// </summary>
internal static class Comparison
{
    public static void Print(BenchArgs options)
    {
        var c = CultureInfo.InvariantCulture;
        int[] targets = [options.RandomTrials / 2, options.RandomTrials];
        var fractions = targets.ToDictionary(t => t, _ => new List<double>());
        double[] shares = [0.125, 0.25, 0.5, 1.0];
        var gaps = shares.ToDictionary(f => f, _ => new List<double>());
        Console.WriteLine($"{DefinitionWords.Of(options.Schedule)}{(options.Brackets > 1 ? $" in {options.Brackets} brackets" : "")} ({options.ProposerLabel}) rounds {options.FirstRung}..{options.FullBudget}, eta {options.Eta}, rate exponent {options.RateExponent}, stopping {(options.Stopping is null ? "off" : options.StopLabel.TrimStart('-'))} against random search at {options.FullBudget} rounds, stopping {(options.RandomStopping is null ? "off" : "on")}; {options.TableLabel} table, {options.Family}");
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

            foreach (double share in shares)
            {
                gaps[share].Add(EqualComputeGap(random, asha, share * random[^1].Compute));
            }

            string ashaBest = string.Create(c, $"{asha[^1].Best:F5} ({asha.Count}, {asha.Count(r => r.Budget == options.TopBudget)})");
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

            double median = Median(list);
            Console.WriteLine(string.Create(c,
                $"random {count} trials: median fraction of its compute that the scheduled search needed to match its best: {(double.IsInfinity(median) ? "not reached" : median.ToString("P1", c))} " +
                $"(seeds: {string.Join(", ", list.Select(f => double.IsInfinity(f) ? ">1" : f.ToString("P1", c)))}; aim: ≤ 25%); " +
                $"missed on {list.Count(f => f > 1)} of {list.Count} (never matched within random search's compute; a match in the trial that crossed it counts as missed)"));
        }

        foreach (double share in shares.Where(s => gaps[s].Count > 0))
        {
            var list = gaps[share];
            double median = Median(list);
            Console.WriteLine(string.Create(c,
                $"at {share,6:P1} of random's {options.RandomTrials}-trial compute: scheduled search ahead on {list.Count(g => g > 0)} of {list.Count} seeds, " +
                $"median lead {median:+0.00000;-0.00000;0.00000} (seeds: {string.Join(", ", list.Select(g => g.ToString("+0.0000;-0.0000;0.0000", c)))})"));
        }
    }

    private static double Median(List<double> values)
    {
        var sorted = values.Order().ToList();
        return sorted.Count % 2 == 1 ? sorted[sorted.Count / 2] : (sorted[(sorted.Count / 2) - 1] + sorted[sorted.Count / 2]) / 2;
    }

    /// <summary>
    /// Random search's best within <paramref name="compute"/> minus the scheduled search's: positive when the scheduled
    /// search is ahead. A scheduled run that stopped before that compute (it had matched random search's final best) is
    /// taken at its final best, which understates its lead there but never turns a lead into a loss.
    /// </summary>
    private static double EqualComputeGap(List<TraceRow> random, List<TraceRow> asha, double compute)
    {
        double BestWithin(List<TraceRow> rows) => rows.Where(r => r.Compute <= compute * (1 + 1e-9)).Select(r => r.Best).DefaultIfEmpty(double.PositiveInfinity).Min();
        double scheduled = asha[^1].Compute < compute ? asha[^1].Best : BestWithin(asha);
        return BestWithin(random) - scheduled;
    }
}
