using System.Diagnostics;
using System.Security.Cryptography;
using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Screening;
using Foldwise.Csv;
using Spectre.Console;

namespace Foldwise.Cli.Running;

/// <summary>
/// CSV → screened table → fold plan (and leaf-size ranges the folds allow), before anything is written: bad input
/// fails here with the file, line and column.
/// </summary>
public static class SearchPreparation
{
    public static PreparedSearch Prepare(SearchDefinition definition, IAnsiConsole console)
    {
        var metric = Metric.For(definition.Metric);
        var clock = Stopwatch.StartNew();
        var train = CsvTableReader.ReadTraining(definition.Data.Train, definition.Data.IdColumn, definition.Data.TargetColumn, metric);
        var rawTest = CsvTableReader.ReadTest(definition.Data.Test, definition.Data.IdColumn, definition.Data.TargetColumn);
        var (test, extra) = TableAlignment.AlignTest(train, rawTest);
        if (train.RowCount < 2 * definition.Folds)
        {
            throw new InputException(definition.Data.Train, $"{train.RowCount} training rows are too few for {definition.Folds} folds; give at least {2 * definition.Folds}");
        }

        console.MarkupLine(
            $"Read [bold]{Markup.Escape(Path.GetFileName(definition.Data.Train))}[/] {train.RowCount:N0} rows × {train.FeatureCount:N0} features " +
            $"({train.Density:P1} non-zero) and [bold]{Markup.Escape(Path.GetFileName(definition.Data.Test))}[/] {test.RowCount:N0} rows in {clock.Elapsed.TotalSeconds:F1} s");
        if (extra.Length > 0)
        {
            console.MarkupLine($"  The test table's {extra.Length} column(s) missing from training are ignored: {Markup.Escape(string.Join(", ", extra.Take(5)))}{(extra.Length > 5 ? ", …" : "")}");
        }

        var report = ColumnScreen.Screen(train, definition.Screening);
        var screenedTrain = ColumnScreen.Apply(report, train);
        var screenedTest = ColumnScreen.Apply(report, test);
        console.MarkupLine(
            $"Screening kept {report.Kept.Length:N0} of {report.ColumnsRead:N0} columns: dropped {report.Count(DropReason.Constant):N0} constant, " +
            $"{report.Count(DropReason.Duplicate):N0} duplicate, {report.Count(DropReason.TooFewNonZero):N0} with fewer than {definition.Screening.MinNonZero} non-zero cells");
        if (report.Kept.Length == 0)
        {
            throw new InputException(definition.Data.Train, "screening dropped every feature column; nothing is left to learn from");
        }

        var folds = StratifiedFoldPlanner.Create([.. screenedTrain.Target.Select(metric.Forward)], definition.Folds, definition.Seed);
        int smallestFold = Enumerable.Range(0, folds.FoldCount).Min(f => folds.TrainRows(f).Length);
        var (fitted, narrowed) = LeafSizeFit.ToFolds(definition, smallestFold);
        foreach (string change in narrowed)
        {
            console.MarkupLine($"  {Markup.Escape(change)}");
        }

        byte[] trainBytes = TableCodec.Encode(screenedTrain);
        byte[] testBytes = TableCodec.Encode(screenedTest);
        return new PreparedSearch(
            fitted, screenedTrain, screenedTest, trainBytes, testBytes,
            Convert.ToHexStringLower(SHA256.HashData(trainBytes)), Convert.ToHexStringLower(SHA256.HashData(testBytes)), report, folds);
    }
}
