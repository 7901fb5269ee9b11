using System.Globalization;
using Foldwise.Core.Learning;
using Foldwise.Core.Schedules;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

/// <summary>
/// How well a short rung ranks candidates: reruns random search's traced candidates (already scored at the full
/// budget) at a short budget, with the learning rate scaled by each exponent asked for, and compares the orders.
/// At the full budget (--probe-rounds equal to --full-budget) it refits them with other fit seeds: the fitting noise.
/// </summary>
internal static class Probe
{
    public static void Run(TrialData data, BenchArgs options, IReadOnlyList<TraceRow> random, int seed, int budget, double[] exponents)
    {
        var c = CultureInfo.InvariantCulture;
        var executor = new TrialExecutor(LearnerCatalog.BuiltIn.Get(options.Family));
        var full = random.Select(r => r.Score).ToArray();
        double bestFull = full.Min();
        int kept = random.Count / options.Eta;
        foreach (double exponent in exponents)
        {
            var rate = new ShortRungRate(exponent);
            var shortScores = random.Select(r => executor.Run(data, rate.For(Parse(r.Parameters), budget, options.FullBudget), budget, seed + r.Trial, options.Threads, CancellationToken.None).Score).ToArray();
            var promoted = Enumerable.Range(0, random.Count).OrderBy(i => shortScores[i]).Take(kept).ToArray();
            double bestPromoted = promoted.Min(i => full[i]);
            Console.WriteLine(string.Create(c,
                $"seed {seed}  rounds {budget}  exponent {exponent:F2}  spearman {Spearman(shortScores, full),6:F3}  best of top {kept} at {options.FullBudget}: {bestPromoted:F5} (regret {bestPromoted - bestFull:F5})  top-1 regret {full[promoted[0]] - bestFull:F5}  best at {budget}: {shortScores.Min():F5}"));
            if (budget == options.FullBudget)
            {
                // At the full budget the probe only changes the fit seed: how much of a score is fitting noise.
                int bestAt = Array.IndexOf(full, bestFull);
                Console.WriteLine(string.Create(c,
                    $"seed {seed}  refit with other fit seeds: random's best {bestFull:F5} refits to {shortScores[bestAt]:F5}; mean |refit − traced| {shortScores.Zip(full, (a, b) => Math.Abs(a - b)).Average():F5}"));
            }
        }
    }

    private static ParameterSet Parse(string text) => ParameterSet.Of(text.Split(' ', StringSplitOptions.RemoveEmptyEntries)
        .Select(p => p.Split('='))
        .Select(kv => KeyValuePair.Create(kv[0], double.Parse(kv[1], CultureInfo.InvariantCulture))));

    private static double Spearman(double[] a, double[] b)
    {
        double[] ra = Ranks(a), rb = Ranks(b);
        double ma = ra.Average(), mb = rb.Average();
        double cov = 0, va = 0, vb = 0;
        for (int i = 0; i < a.Length; i++)
        {
            cov += (ra[i] - ma) * (rb[i] - mb);
            va += (ra[i] - ma) * (ra[i] - ma);
            vb += (rb[i] - mb) * (rb[i] - mb);
        }

        return cov / Math.Sqrt(va * vb);
    }

    /// <summary>Ranks 0..n−1 in score order; ties are not averaged (scores here are continuous).</summary>
    private static double[] Ranks(double[] values)
    {
        var ranks = new double[values.Length];
        var order = Enumerable.Range(0, values.Length).OrderBy(i => values[i]).ToArray();
        for (int r = 0; r < order.Length; r++)
        {
            ranks[order[r]] = r;
        }

        return ranks;
    }
}
