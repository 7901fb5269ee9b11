using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Csv;
using Foldwise.Testing;

namespace Foldwise.Cli.Tests;

[Trait(Lane.Key, Lane.Slow)]
public sealed class DemoCommandTests : IDisposable
{
    private readonly Workspace workspace = new();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public void Writes_the_invented_tables_and_a_definition_that_reads_back()
    {
        var demo = CliHarness.Run("demo", "--quick", "--data-only", "--out", workspace.Out);

        Assert.True(demo.ExitCode == 0, demo.Output);
        Assert.Contains("train.csv 800 × 400, test.csv 3,200 rows, search.json", demo.Output);
        var definition = DefinitionReader.Read(Path.Combine(workspace.Out, "search.json"));
        var train = CsvTableReader.ReadTraining(definition.Data.Train, definition.Data.IdColumn, definition.Data.TargetColumn, Metric.Rmsle);
        Assert.Equal(800, train.RowCount);
        Assert.Equal(["fasttree", "lightgbm"], definition.Families.Select(f => f.Family).Order());
        Assert.False(File.Exists(Path.Combine(workspace.Out, "search.db")), "--data-only runs nothing");
    }

    [Fact]
    public void Runs_the_quick_demo_end_to_end_to_a_prediction_per_test_row()
    {
        var demo = CliHarness.Run("demo", "--quick", "--out", workspace.Out);

        Assert.True(demo.ExitCode == 0, demo.Output);
        Assert.Contains("Search stopped (trial budget reached): 40 done", demo.Output);
        Assert.Contains("nested estimate", demo.Output);
        var rows = File.ReadAllLines(Path.Combine(workspace.Out, "predictions.csv"));
        Assert.Equal("shipper_id,predicted_q1_spend", rows[0]);
        Assert.Equal(3201, rows.Length);
    }
}
