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
    public void A_training_text_column_that_holds_only_numbers_in_the_test_table_names_both_files()
    {
        // "lots" makes f1 a category column in training; the test table's f1 holds only numbers
        workspace.Write("train.csv", "id,f1,y\na,1,2\nb,lots,2\n");

        AssertRefused(workspace.WriteDefinition(), "test.csv", "column 'f1' holds text in", "train.csv");
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

    [Fact]
    public void A_missing_target_cell_gives_its_line_and_column()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\nb,2,NA\nc,3,4\nd,1,2\ne,2,3\nf,3,4\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:3", "the target 'y' is missing");
    }

    [Fact]
    public void A_missing_id_cell_gives_its_line_and_column()
    {
        workspace.Write("train.csv", "id,f1,y\na,1,2\n,2,3\nc,3,4\nd,1,2\ne,2,3\nf,3,4\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:1", "the id is missing");
    }

    [Fact]
    public void A_column_numeric_in_training_and_text_in_the_test_table_names_both_files()
    {
        workspace.Write("test.csv", "id,f5,f4,f3,f2,f1\nb0,1,1,1,1,1\nb1,1,1,1,x,1\n");

        AssertRefused(workspace.WriteDefinition(), "test.csv:3:5", "column 'f2' holds only numbers in", "train.csv");
    }

    [Fact]
    public void A_default_missing_word_that_may_be_a_level_is_refused_naming_the_column()
    {
        var rows = string.Concat(Enumerable.Range(0, 12).Select(r => $"a{r},{r % 3},{(r % 4) switch { 0 => "NA", 1 => "", _ => "EU" }},{r + 1}\n"));
        workspace.Write("train.csv", "id,f1,region,y\n" + rows);
        workspace.Write("test.csv", "id,f1,region\nb0,1,EU\n");

        AssertRefused(workspace.WriteDefinition(), "train.csv:3:3", "category column 'region'", "data.missing");
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
