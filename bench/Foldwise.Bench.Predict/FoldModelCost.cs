using System.Diagnostics;
using System.Globalization;
using Foldwise.Core.Demo;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Spaces;
using Foldwise.Learners;

namespace Foldwise.Bench.Predict;

/// <summary>
/// One kept fold model per family on the full demo, at a given budget, fitted on fold 0 with the middle of the family's
/// default space: its size on disk, and the time it takes to score the new rows. For a family whose whole search
/// cannot run on the machine, this gives its kept size and scoring cost per round. The fit is repeated scoring the new
/// rows as a search scores its test table, and the kept model's scores are compared with those.
/// </summary>
internal static class FoldModelCost
{
    public static void Run(IReadOnlyList<(string Family, int Budget)> fits, int newRows, int seed)
    {
        var (train, _) = FreightDemo.Generate(DemoSize.Full, seed);
        var rows = FreightDemo.NewRows(DemoSize.Full, seed, newRows);
        var screen = ColumnScreen.Screen(train, new ScreeningOptions());
        train = ColumnScreen.Apply(screen, train);
        rows = ColumnScreen.Apply(screen, rows);
        var target = train.Target.Select(Metric.Rmsle.Forward).ToArray();
        var data = TrialData.From(train, rows, StratifiedFoldPlanner.Create(target, 5, seed), Metric.Rmsle);
        var trainRows = data.Folds.TrainRows(0);
        Console.WriteLine($"fold 0 of the full demo: {trainRows.Length} training rows x {train.FeatureCount} columns; {rows.RowCount:N0} new rows; one thread");
        Console.WriteLine("family     budget   fit s   model MB  KB/round   kept model scores the new rows   largest difference from the fit's own | load");
        foreach (var (family, budget) in fits)
        {
            var keeper = (IKeepsModels)LearnerCatalog.BuiltIn.Get(family);
            var inputs = data.InputsFor(0, family);
            var job = new FoldJob(data, 0, trainRows, data.Folds.ValidationRows(0), Middle(DefaultSpaces.For(family)), budget, seed, 1, inputs, PredictsTest: false);
            var clock = Stopwatch.StartNew();
            var kept = keeper.FitAndKeep(job, CancellationToken.None);
            double fit = clock.Elapsed.TotalSeconds;

            // The same fit again, scoring the new rows as a search scores its test table, to compare with the kept model's scores.
            var own = keeper.FitAndKeep(job with { PredictsTest = true }, CancellationToken.None).Prediction.Test;
            clock.Restart();
            var again = keeper.PredictKept(job, kept.Model);
            double fromKept = clock.Elapsed.TotalSeconds;
            double difference = own.Zip(again).Max(p => Math.Abs(p.First - p.Second));
            Console.WriteLine(string.Create(
                CultureInfo.InvariantCulture,
                $"{family,-10} {budget,6} {fit,7:F1} {kept.Model.Length / 1e6,10:F2} {kept.Model.Length / 1e3 / budget,9:F1}   {fromKept,28:F2} s   {difference,38:G3} | {Load()}"));
        }
    }

    private static string Load() => File.Exists("/proc/loadavg") ? string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3)) : "n/a";

    // The middle of each range, as the families bench takes it: the mean for linear scales, the geometric mean for log scales.
    private static ParameterSet Middle(ParameterSpace space) => ParameterSet.Of(space.Ranges.Select(r => KeyValuePair.Create(r.Name, r.Kind switch
    {
        ParameterKind.Log => Math.Sqrt(r.Low * r.High),
        ParameterKind.Whole or ParameterKind.OneOf => Math.Round((r.Low + r.High) / 2),
        _ => (r.Low + r.High) / 2,
    })));
}
