using System.Collections.Immutable;
using Foldwise.Core.Data;
using Foldwise.Core.Encodings;
using Foldwise.Core.Folds;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;
using Foldwise.Testing;

namespace Foldwise.Tuning.Tests;

public sealed class SharedFoldInputsTests
{
    [Fact]
    public void Gives_each_seed_the_inputs_its_own_encoding_gives_while_encoding_the_new_rows_once()
    {
        // Given 90 training rows whose category column is target-mean encoded (three levels of 30 rows) and 5 new rows
        string[] levels = ["a", "b", "c"];
        var train = TinyTables.WithCategory(
            TinyTables.FromColumns([("x", [.. Enumerable.Range(0, 90).Select(i => (float)(i % 7))])], [.. Enumerable.Range(0, 90).Select(i => (double)((i * 37) % 11))]),
            "c",
            [.. Enumerable.Range(0, 90).Select(i => levels[i % 3])]);
        var rows = TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 0, 3, 0, 5])]), "c", "a", "b", "c", null, "new");
        var plan = new FoldPlan(3, 0, [.. Enumerable.Range(0, 90).Select(i => (i / 3) % 3)]);
        var data = TrialData.From(train, rows, plan, Metric.Rmse);
        data = data with { Categories = [.. data.Categories.Select(c => c with { Kind = CategoryEncodingKind.TargetMean })] };
        var trainRows = plan.TrainRows(0);

        // When one fold's inputs are shared by the seeds 11, 12 and 11 again
        var shared = SharedFoldInputs.Encode(data, trainRows, seed: 11, CategoryEncodingKind.Indicators);
        var first = shared.For(11);
        var second = shared.For(12);

        // Then each seed's inputs are those its own encoding gives, the new rows the same object for both
        AssertSameCells(data.InputsFor(trainRows, 11, CategoryEncodingKind.Indicators).Train, first.Train);
        AssertSameCells(data.InputsFor(trainRows, 12, CategoryEncodingKind.Indicators).Train, second.Train);
        AssertSameCells(data.InputsFor(trainRows, 12, CategoryEncodingKind.Indicators).Test, second.Test);
        Assert.NotEqual(first.Train.Values, second.Train.Values);
        Assert.Same(first.Test, second.Test);
        Assert.Same(first, shared.For(11));
    }

    [Fact]
    public void Gives_every_seed_the_level_code_columns_of_its_own_encoding()
    {
        // Given a few-level column read as level codes, and a target-mean column, over 90 training rows and 3 new rows
        string[] levels = ["a", "b", "c"];
        var train = TinyTables.WithCategory(
            TinyTables.WithCategory(
                TinyTables.FromColumns([("x", [.. Enumerable.Range(0, 90).Select(i => (float)(i % 7))])], [.. Enumerable.Range(0, 90).Select(i => (double)((i * 37) % 11))]),
                "few",
                [.. Enumerable.Range(0, 90).Select(i => levels[i % 3])]),
            "wide",
            [.. Enumerable.Range(0, 90).Select(i => levels[(i / 3) % 3])]);
        var rows = TinyTables.WithCategory(TinyTables.WithCategory(TinyTables.FromColumns([("x", [1, 0, 3])]), "few", "a", "new", null), "wide", "b", "c", "a");
        var plan = new FoldPlan(3, 0, [.. Enumerable.Range(0, 90).Select(i => (i / 3) % 3)]);
        var data = TrialData.From(train, rows, plan, Metric.Rmse);
        data = data with { Categories = [data.Categories[0], data.Categories[1] with { Kind = CategoryEncodingKind.TargetMean }] };
        var trainRows = plan.TrainRows(0);

        // When the fold's level-code inputs are shared by the seeds 11 and 12
        var shared = SharedFoldInputs.Encode(data, trainRows, seed: 11, CategoryEncodingKind.LevelCodes);
        var second = shared.For(12);

        // Then the second seed's inputs are its own encoding's, with the same column of level codes declared
        var own = data.InputsFor(trainRows, 12, CategoryEncodingKind.LevelCodes);
        AssertSameCells(own.Train, second.Train);
        AssertSameCells(own.Test, second.Test);
        Assert.Equal([1], second.LevelCodeColumns.ToArray());
        Assert.Equal(own.LevelCodeColumns.ToArray(), shared.For(11).LevelCodeColumns.ToArray());
    }

    private static void AssertSameCells(SparseRowMatrix expected, SparseRowMatrix actual)
    {
        Assert.Equal(expected.RowStarts, actual.RowStarts);
        Assert.Equal(expected.ColumnIndices, actual.ColumnIndices);
        Assert.Equal(expected.Values, actual.Values);
    }
}
