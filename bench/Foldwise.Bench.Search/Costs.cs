using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Learning;
using Foldwise.Core.Schedules;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Learners.Native;

/// <summary>
/// What one LightGBM trial costs at the first rung and at the full budget, split into preparing the folds (encoding
/// and binning), fitting the rounds, scoring the held-out rows and scoring the whole test table: the last is what a
/// trial below the full budget no longer does. Random candidates, every fold, the whole test table; the same candidates
/// at both budgets, so the full budget reuses each fold's binned rows as a promotion does.
/// </summary>
internal static class Costs
{
    public static void Run(TrialData data, BenchArgs options, int seed, int candidates)
    {
        var c = CultureInfo.InvariantCulture;
        var space = DefaultSpaces.For(options.Family);
        var random = new Random(seed);
        Console.WriteLine($"seed {seed}: {candidates} random candidates, {data.Folds.FoldCount} folds, {data.Train.RowCount} training rows, {data.Test.RowCount} test rows; seconds per trial");
        Console.WriteLine("budget  candidate  prepare    fit  score held-out  score test  test share  rounds kept");
        // The same candidates at both budgets, as a promotion: at the full budget each fold's binned rows are reused.
        var draws = Enumerable.Range(0, candidates).Select(_ => ParameterSet.Of(space.Ranges.Select(r => KeyValuePair.Create(r.Name, Draw(r, random))))).ToArray();
        foreach (int budget in new[] { options.FirstRung, options.FullBudget })
        {
            double[] totals = new double[4];
            for (int k = 0; k < candidates; k++)
            {
                var drawn = draws[k];
                var run = new ShortRungRate(options.RateExponent).For(drawn, budget, options.FullBudget);
                var (prepare, fit, heldOut, test, rounds) = Trial(data, run, budget, seed + k, options.Threads);
                double[] parts = [prepare, fit, heldOut, test];
                for (int i = 0; i < 4; i++)
                {
                    totals[i] += parts[i];
                }

                Console.WriteLine(string.Create(c, $"{budget,6}  {k + 1,9}  {prepare,7:F2}  {fit,5:F2}  {heldOut,14:F2}  {test,10:F2}  {test / parts.Sum(),10:P0}  {rounds}"));
            }

            Console.WriteLine(string.Create(c, $"{budget,6}  {"mean",9}  {totals[0] / candidates,7:F2}  {totals[1] / candidates,5:F2}  {totals[2] / candidates,14:F2}  {totals[3] / candidates,10:F2}  {totals[3] / totals.Sum(),10:P0}"));
        }
    }

    /// <summary>A uniform draw from the range (log-uniform for a log range, rounded for a whole one).</summary>
    private static double Draw(ParameterRange range, Random random)
    {
        double u = random.NextDouble();
        return range.Kind switch
        {
            ParameterKind.Log => Math.Exp(Math.Log(range.Low) + (u * (Math.Log(range.High) - Math.Log(range.Low)))),
            ParameterKind.Whole => Math.Round(range.Low + (u * (range.High - range.Low))),
            _ => range.Low + (u * (range.High - range.Low)),
        };
    }

    private static (double Prepare, double Fit, double HeldOut, double Test, int Rounds) Trial(TrialData data, ParameterSet parameters, int budget, int seed, int threads)
    {
        double prepare = 0, fit = 0, heldOut = 0, test = 0;
        int rounds = 0;
        for (int f = 0; f < data.Folds.FoldCount; f++)
        {
            var clock = Stopwatch.StartNew();
            var trainRows = data.Folds.TrainRows(f);
            int foldSeed = SearchSeeds.Fold(seed, f);
            var job = new FoldJob(data, f, trainRows, data.Folds.ValidationRows(f), parameters, budget, foldSeed, threads, data.InputsFor(f, FamilyNames.LightGbm));
            using var model = LightGbmFoldModel.Start(job, scoreEachRound: false, CancellationToken.None);
            prepare += clock.Elapsed.TotalSeconds;
            clock.Restart();
            model.Continue(budget, CancellationToken.None);
            fit += clock.Elapsed.TotalSeconds;
            clock.Restart();
            model.Predict(model.Rounds, withTest: false);
            double held = clock.Elapsed.TotalSeconds;
            heldOut += held;
            clock.Restart();
            model.Predict(model.Rounds, withTest: true);
            test += Math.Max(0, clock.Elapsed.TotalSeconds - held);
            rounds = model.Rounds;
        }

        return (prepare, fit, heldOut, test, rounds);
    }
}
