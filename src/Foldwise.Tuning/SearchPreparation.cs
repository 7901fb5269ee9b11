using System.Diagnostics;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Core.Search;
using Foldwise.Csv;

namespace Foldwise.Tuning;

/// <summary>
/// CSV → screened table → fold plan, before anything is written: bad input fails here with the file, line and column.
/// </summary>
public static class SearchPreparation
{
    public static PreparedSearch Prepare(SearchDefinition definition, IProgress<SearchEvent> events)
    {
        var metric = Metric.For(definition.Metric);
        var clock = Stopwatch.StartNew();
        var rules = definition.Data.Rules;
        var train = CsvTableReader.ReadTraining(
            definition.Data.Train, definition.Data.IdColumn, definition.Data.TargetColumn, metric, rules, Paced(PreparationStep.Reading, definition.Data.Train, events));
        var rawTest = CsvTableReader.ReadTest(
            definition.Data.Test, definition.Data.IdColumn, definition.Data.TargetColumn, rules, train, Paced(PreparationStep.Reading, definition.Data.Test, events));
        var (test, extra) = TableAlignment.AlignTest(train, rawTest);
        if (train.RowCount < 2 * definition.Folds)
        {
            throw new InputException(definition.Data.Train, $"{train.RowCount} training rows are too few for {definition.Folds} folds; give at least {2 * definition.Folds}");
        }

        events.Report(new TablesRead(
            definition.Data.Train, train.RowCount, train.FeatureCount, train.Density, definition.Data.Test, test.RowCount, clock.Elapsed, [.. extra]));

        var report = TestLevelCount.Add(ColumnScreen.Screen(train, definition.Screening, Paced(PreparationStep.Screening, Path.GetFileName(definition.Data.Train), events)), train, test);
        var screenedTrain = ColumnScreen.Apply(report, train);
        var screenedTest = ColumnScreen.Apply(report, test);
        events.Report(new ColumnsScreened(report, definition.Screening.MinNonZero, definition.Families));
        if (report.Kept.Length == 0 && report.Categories.Length == 0)
        {
            throw new InputException(definition.Data.Train, "screening dropped every feature column; nothing is left to learn from");
        }

        var folds = StratifiedFoldPlanner.Create([.. screenedTrain.Target.Select(metric.Forward)], definition.Folds, new SearchSeeds(definition.Seed).FoldPlan);
        int smallestFold = Enumerable.Range(0, folds.FoldCount).Min(f => folds.TrainRows(f).Length);
        var (fitted, narrowed) = LeafSizeFit.ToFolds(definition, smallestFold);
        if (!narrowed.IsEmpty)
        {
            events.Report(new LeafSizesNarrowed(narrowed));
        }

        return new PreparedSearch(fitted, screenedTrain, screenedTest, report, folds);
    }

    private static Action<long, long> Paced(PreparationStep step, string subject, IProgress<SearchEvent> events) =>
        ProgressPacer.For(step, Path.GetFileName(subject), events).Tick;
}
