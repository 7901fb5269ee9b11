namespace Foldwise.Cli.Tests;

/// <summary>Every kind of bad input exits 1 with one line naming the file (and line and column), and writes nothing.</summary>
public sealed class BadInputTests : IDisposable
{
    private readonly Workspace workspace = new();

    public BadInputTests() => workspace.WriteTables();

    public void Dispose() => workspace.Dispose();

    [Fact]
    public void A_missing_training_file_is_named()
    {
        File.Delete(workspace.PathOf("train.csv"));

        AssertRefused(workspace.WriteDefinition(), "train.csv");
    }

    [Fact]
    public void An_empty_training_file_is_named()
    {
        workspace.Write("train.csv", "");

        AssertRefused(workspace.WriteDefinition(), "train.csv");
    }

    [Fact]
    public void A_header_without_rows_is_named()
    {
        workspace.Write("train.csv", "id,f1,y\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv");
    }

    [Fact]
    public void A_missing_target_column_is_named()
    {
        workspace.Write("train.csv", "id,f1\na,1\nb,2\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv", "'y'");
    }

    [Fact]
    public void A_ragged_row_gives_its_line()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\nb,2\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3");
    }

    [Fact]
    public void Text_in_a_numeric_column_gives_its_line_and_column()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\nb,lots,2\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:2");
    }

    [Fact]
    public void A_negative_target_under_rmsle_gives_its_line_and_column()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\nb,2,-4\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:3");
    }

    [Fact]
    public void A_non_finite_target_gives_its_line_and_column()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,NaN\nb,2,3\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:2:3");
    }

    [Fact]
    public void Duplicate_ids_are_named()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\na,2,3\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:1", "\"a\"", "line 2");
    }

    [Fact]
    public void A_test_table_missing_a_training_feature_is_named()
    {
        workspace.Write("test.csv", "id,f1,f2,f3,f4\nb,1,1,1,1\n");

        AssertRefused(workspace.WriteDefinition(), "test.csv", "f5");
    }

    [Fact]
    public void An_unknown_definition_key_gives_its_line_and_column()
    {
        string definition = workspace.WriteDefinition(extra: ",\n  \"blend_mode\": \"simplex\"");

        AssertRefused(definition, "search.json:9:3", "blend_mode");
    }

    private void AssertRefused(string definition, params string[] mustName)
    {
        var run = CliHarness.Run("run", definition, "--out", workspace.Out);

        Assert.Equal(1, run.ExitCode);
        string message = run.Output.Trim();
        Assert.StartsWith("foldwise: ", message, StringComparison.Ordinal);
        Assert.Single(message.Split('\n'));
        Assert.All(mustName, m => Assert.Contains(m, message, StringComparison.Ordinal));
        Assert.False(Directory.Exists(workspace.Out), "nothing may be written for bad input");
    }
}
