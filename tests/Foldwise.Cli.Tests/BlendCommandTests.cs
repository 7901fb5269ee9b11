using System.Globalization;
using System.Text.Json;
using Foldwise.Cli.Report;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Core.Search;
using Foldwise.Storage;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;
using Foldwise.Tuning;
using Spectre.Console.Testing;

namespace Foldwise.Cli.Tests;

[Trait(Lane.Key, Lane.Slow)]
public sealed class BlendCommandTests(FinishedSearch search) : IClassFixture<FinishedSearch>
{
    [Theory]
    [InlineData("simplex")]
    [InlineData("non_negative")]
    [InlineData("greedy")]
    public void Lists_each_pool_member_with_its_trial_and_weight_as_json(string mode)
    {
        var blend = CliHarness.Run("blend", search.Store, "--mode", mode, "--pool", "2", "--json");

        Assert.True(blend.ExitCode == 0, blend.Output);
        using var json = JsonDocument.Parse(blend.Output);
        var members = json.RootElement.GetProperty("members").EnumerateArray().ToList();
        Assert.NotEmpty(members);
        Assert.True(members.Count <= 4, "two per family at most");
        Assert.All(members, m => Assert.True(m.GetProperty("trial").GetInt32() > 0));
        Assert.All(members, m => Assert.InRange(m.GetProperty("weight").GetDouble(), 0, double.MaxValue));
        double sum = members.Sum(m => m.GetProperty("weight").GetDouble());
        Assert.Equal(mode, json.RootElement.GetProperty("mode").GetString());
        if (mode != "non_negative")
        {
            Assert.Equal(1, sum, 9);
        }

        // The blend is never worse in sample than the best single trial it could have chosen alone
        Assert.True(json.RootElement.GetProperty("in_sample_score").GetDouble() <= json.RootElement.GetProperty("best_single_score").GetDouble() + 1e-12);
        Assert.Equal(3, json.RootElement.GetProperty("nested_fold_scores").GetArrayLength());
    }

    [Fact]
    public void Refuses_the_retired_mode_word_and_names_the_definitions_spelling()
    {
        var blend = CliHarness.Run("blend", search.Store, "--mode", "nonneg");

        Assert.Equal(ExitCodes.Usage, blend.ExitCode);
        Assert.Contains("--mode 'nonneg' is not one of simplex, non_negative, greedy ('nonneg' is a retired name; did you mean non_negative?)", blend.Output);
    }

    [Fact]
    public void Prints_the_chosen_trials_weights_and_both_estimates_for_a_person()
    {
        var blend = CliHarness.Run("blend", search.Workspace.Out);

        Assert.True(blend.ExitCode == 0, blend.Output);
        Assert.Contains("Blend (simplex)", blend.Output);
        Assert.Contains("weight", blend.Output);
        Assert.Contains("in-sample", blend.Output);
        Assert.Contains("nested estimate", blend.Output);
        Assert.Contains("best single trial", blend.Output);
        Assert.Contains("predictions.csv: 15 predictions", blend.Output);
    }

    [Fact]
    public void Export_writes_each_full_budget_trials_out_of_fold_predictions_whose_score_matches_the_history()
    {
        string file = Path.Combine(search.Workspace.Root, "oof.csv");

        var export = CliHarness.Run("export", search.Store, "--oof", file);
        var history = JsonDocument.Parse(CliHarness.Run("history", search.Store, "--json").Output);

        Assert.True(export.ExitCode == 0, export.Output);
        var lines = File.ReadAllLines(file);
        var header = lines[0].Split(',');
        Assert.Equal(["id", "y"], header.Take(2));
        Assert.Equal(91, lines.Length);
        Assert.True(header.Length > 2, "at least one trial reached the full budget");

        // Recompute RMSLE from the exported file (original scale) and compare with the stored OOF score
        int trialId = int.Parse(header[2]["trial_".Length..], CultureInfo.InvariantCulture);
        double sum = 0;
        foreach (var row in lines.Skip(1).Select(l => l.Split(',')))
        {
            double actual = double.Parse(row[1], CultureInfo.InvariantCulture);
            double predicted = double.Parse(row[2], CultureInfo.InvariantCulture);
            double e = Math.Log(1 + actual) - Math.Log(1 + predicted);
            sum += e * e;
        }

        double stored = history.RootElement.EnumerateArray().Single(t => t.GetProperty("id").GetInt32() == trialId).GetProperty("score").GetDouble();
        Assert.Equal(stored, Math.Sqrt(sum / 90), 9);
    }

    [Fact]
    public void An_abandoned_blend_writes_neither_the_prediction_file_nor_the_blend_record()
    {
        // Given the finished search's prediction file and stored blend (simplex, the definition's mode)
        string predictions = Path.Combine(search.Workspace.Out, BlendStep.PredictionFileName);
        Assert.Equal(0, CliHarness.Run("blend", search.Store).ExitCode);
        byte[] before = File.ReadAllBytes(predictions);

        // When a blend in another mode is abandoned (a second Ctrl-C) before it writes
        using (var store = SearchStore.Open(search.Store))
        {
            var (header, definition) = StoredSearch.HeaderOf(store);
            Assert.Throws<OperationCanceledException>(() => BlendStep.Run(
                store, header, definition, search.Workspace.Out, NoEvents.Instance, new BlendOptions(BlendMode.Greedy, 2), abandon: new CancellationToken(canceled: true)));

            // Then the store still holds the earlier blend, and the file is byte for byte the earlier one
            Assert.Equal(BlendMode.Simplex, store.LoadBlend()!.Mode);
        }

        Assert.Equal(before, File.ReadAllBytes(predictions));
        Assert.False(File.Exists(predictions + ".part"));
    }

    [Fact]
    public void Names_how_far_each_family_went_when_no_trial_reached_its_full_budget()
    {
        // Given a copy of the finished search, read with a full budget that none of its trials reached
        using var folder = new Workspace();
        string copy = folder.PathOf("search.db");
        File.Copy(search.Store, copy);
        using var store = SearchStore.Open(copy);
        var (header, definition) = StoredSearch.HeaderOf(store);
        var unreached = definition with
        {
            Schedule = definition.Schedule with { FullBudget = 100_000 },
            Families = [.. definition.Families.Select(f => f with { Budget = null })],
        };
        var done = store.LoadTrials().Where(t => t.State == TrialState.Done).ToList();

        // When it is blended
        var events = new SyncEvents();
        BlendStep.Run(store, header, unreached, folder.Root, events);

        // Then the blend says, for each family with done trials in the definition's order, how far it went
        var fellBack = Assert.Single(events.OfType<BlendFellBack>());
        Assert.Equal(
            definition.Families.Select(f => f.Family).Where(f => done.Any(t => t.Family == f)),
            fellBack.Families.Select(r => r.Family));
        Assert.All(fellBack.Families, r => Assert.Equal(done.Where(t => t.Family == r.Family).Max(t => t.Budget), r.Furthest));
        Assert.All(fellBack.Families, r => Assert.EndsWith(" of 100000 rounds", r.ToString(), StringComparison.Ordinal));
        Assert.True(fellBack.Families.Length >= 2, "the finished search has trials of two families");
    }
}
