using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Events;
using Foldwise.Storage;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;

namespace Foldwise.Tuning.Tests;

/// <summary>
/// The blend's kept models score new rows as the search scored its test table; bad input is refused with one line and
/// nothing written. Each test works on its own copy of one finished quick-demo search.
/// </summary>
[Trait(Lane.Key, Lane.Slow)]
public sealed class KeptModelsTests(KeptDemoRun run) : IClassFixture<KeptDemoRun>, IDisposable
{
    private readonly TempFolder copy = new();

    [Fact]
    public void Scoring_the_search_s_own_test_table_reproduces_its_prediction_file()
    {
        // Given a finished search that kept its blend's models
        string outDir = CopyOfSearch();
        var kept = Assert.Single(run.Events.OfType<ModelsKept>()).Kept;
        Assert.Equal(run.Result.Blend!.Members.Where(m => m.Weight > 0).Select(m => m.TrialId).Order(), kept.Members.Select(m => m.TrialId).Order());

        // When its test table is scored again from the kept models
        string scored = copy.PathOf("scored.csv");
        KeptScoring.Predict(outDir, TestCsv, scored, threads: 2);

        // Then the file has the search's header and ids, and every prediction within a relative 1e-6 of the search's own
        var (ownHeader, own) = ReadPredictions(run.Result.PredictionFile);
        var (header, again) = ReadPredictions(scored);
        Assert.Equal(ownHeader, header);
        Assert.Equal(own.Select(p => p.Id), again.Select(p => p.Id));
        Assert.All(own.Zip(again), pair => Assert.True(Math.Abs(pair.First.Value - pair.Second.Value) <= 1e-6 * Math.Abs(pair.First.Value), $"{pair.First.Id}: {pair.First.Value:R} vs {pair.Second.Value:R}"));
    }

    [Fact]
    public void A_row_is_scored_the_same_whatever_other_rows_come_with_it()
    {
        // Given the test table's last 40 rows, in reverse order, as a table of new rows
        string outDir = CopyOfSearch();
        var lines = File.ReadAllLines(TestCsv);
        string rows = copy.PathOf("rows.csv");
        File.WriteAllLines(rows, [lines[0], .. lines[^40..].Reverse()]);

        // When they are scored
        string scored = copy.PathOf("scored.csv");
        KeptScoring.Predict(outDir, rows, scored, threads: 1);

        // Then each row gets the prediction the search gave it
        var own = ReadPredictions(run.Result.PredictionFile).Rows.ToDictionary(p => p.Id, p => p.Value);
        var again = ReadPredictions(scored).Rows;
        Assert.Equal(40, again.Count);
        Assert.All(again, p => Assert.True(Math.Abs(own[p.Id] - p.Value) <= 1e-6 * Math.Abs(own[p.Id]), $"{p.Id}: {own[p.Id]:R} vs {p.Value:R}"));
    }

    [Fact]
    public void Refuses_rows_without_a_training_feature_naming_it()
    {
        // Given new rows without one of the features the search trained on
        string outDir = CopyOfSearch();
        string feature = KeptFeature();
        string rows = WithoutColumn(feature);

        // When they are scored, then the column is named and nothing is written
        var error = Assert.Throws<InputException>(() => KeptScoring.Predict(outDir, rows, copy.PathOf("scored.csv"), threads: 1));
        Assert.Contains($"'{feature}'", error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(copy.PathOf("scored.csv")));
    }

    [Fact]
    public void Refuses_text_in_a_numeric_column_naming_its_line_and_column()
    {
        // Given new rows whose second data line holds text in a numeric feature
        string outDir = CopyOfSearch();
        var lines = File.ReadAllLines(TestCsv);
        int column = Array.IndexOf(lines[0].Split(','), KeptFeature());
        var cells = lines[2].Split(',');
        cells[column] = "lots";
        lines[2] = string.Join(',', cells);
        string rows = copy.PathOf("rows.csv");
        File.WriteAllLines(rows, lines);

        // When they are scored, then the line and column are named and nothing is written
        var error = Assert.Throws<InputException>(() => KeptScoring.Predict(outDir, rows, copy.PathOf("scored.csv"), threads: 1));
        Assert.StartsWith($"{rows}:3:{column + 1}: ", error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(copy.PathOf("scored.csv")));
    }

    [Fact]
    public void Refuses_rows_without_the_id_column()
    {
        // Given new rows without their id column
        string outDir = CopyOfSearch();
        string rows = WithoutColumn("shipper_id");

        // When they are scored, then the id column is named and nothing is written
        var error = Assert.Throws<InputException>(() => KeptScoring.Predict(outDir, rows, copy.PathOf("scored.csv"), threads: 1));
        Assert.Contains("shipper_id", error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(copy.PathOf("scored.csv")));
    }

    [Fact]
    public void Refuses_a_store_that_kept_no_models_and_says_how_to_keep_them()
    {
        // Given a search whose record of kept models is gone (as in a store from before models were kept)
        string outDir = CopyOfSearch();
        using (var store = SearchStore.Open(StoreFile.PathIn(outDir)))
        {
            store.ForgetKept();
        }

        // When its rows are scored, then it says to re-run the blend, and nothing is written
        var error = Assert.Throws<InputException>(() => KeptScoring.Predict(outDir, TestCsv, copy.PathOf("scored.csv"), threads: 1));
        Assert.Contains("kept no models", error.Message, StringComparison.Ordinal);
        Assert.Contains("foldwise blend", error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(copy.PathOf("scored.csv")));
    }

    [Fact]
    public void Refuses_a_models_folder_whose_hash_does_not_match_the_store()
    {
        // Given a kept model file replaced by another one (a models folder from another search)
        string outDir = CopyOfSearch();
        var files = Directory.GetFiles(KeptModelFiles.FolderIn(outDir));
        File.Copy(files[1], files[0], overwrite: true);

        // When rows are scored, then the file is named with both hashes and nothing is written
        var error = Assert.Throws<InputException>(() => KeptScoring.Predict(outDir, TestCsv, copy.PathOf("scored.csv"), threads: 1));
        Assert.Contains(Path.GetFileName(files[0]), error.Message, StringComparison.Ordinal);
        Assert.Contains("SHA-256", error.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(copy.PathOf("scored.csv")));
    }

    [Fact]
    public void A_blend_solved_again_keeps_its_new_members_models_and_drops_the_others()
    {
        // Given a finished search re-blended with a pool of one trial per family
        string outDir = CopyOfSearch();
        var events = new SyncEvents();
        using (var store = SearchStore.Open(StoreFile.PathIn(outDir)))
        {
            var header = store.LoadHeader()!;
            var blend = BlendStep.Run(store, header, header.Definition, outDir, events, new BlendOptions(BlendMode.Simplex, Pool: 1));

            // Then the store records exactly the new members, each with its file
            var kept = store.LoadKept()!;
            Assert.Equal(blend.Members.Where(m => m.Weight > 0).Select(m => m.TrialId).Order(), kept.Members.Select(m => m.TrialId).Order());
            Assert.Equal(kept.Members.Select(m => m.Hash + ".fwm").Order(), Directory.GetFiles(KeptModelFiles.FolderIn(outDir)).Select(Path.GetFileName).Order());
        }

        // And the new blend's prediction file is what its kept models give
        string scored = copy.PathOf("scored.csv");
        KeptScoring.Predict(outDir, TestCsv, scored, threads: 1);
        var own = ReadPredictions(Path.Combine(outDir, BlendStep.PredictionFileName)).Rows;
        var again = ReadPredictions(scored).Rows;
        Assert.All(own.Zip(again), pair => Assert.True(Math.Abs(pair.First.Value - pair.Second.Value) <= 1e-6 * Math.Abs(pair.First.Value), $"{pair.First.Id}"));
    }

    [Fact]
    public void Keeps_no_models_when_a_re_fit_does_not_reproduce_the_search_s_test_predictions()
    {
        // Given a search whose stored test predictions of one blend member are not what its models give
        string outDir = CopyOfSearch();
        var events = new SyncEvents();
        using var store = SearchStore.Open(StoreFile.PathIn(outDir));
        var header = store.LoadHeader()!;
        int member = store.LoadBlend()!.Members.First(m => m.Weight > 0).TrialId;
        var (outOfFold, test) = store.LoadVectors(member)!.Value;
        store.SaveVectors(member, outOfFold, [.. test.Select(p => p * (1 + 1e-5))]);
        File.Delete(Directory.GetFiles(KeptModelFiles.FolderIn(outDir)).Single(f => f.Contains(store.LoadKept()!.Members.Single(m => m.TrialId == member).Hash, StringComparison.Ordinal)));

        // When the blend is solved again and its members re-fitted
        BlendStep.Run(store, header, header.Definition, outDir, events);

        // Then it says why no models were kept, and the store records none
        var notKept = Assert.Single(events.OfType<ModelsNotKept>());
        Assert.Contains($"trial {member}", notKept.Reason, StringComparison.Ordinal);
        Assert.Null(store.LoadKept());
    }

    public void Dispose() => copy.Dispose();

    private string TestCsv => run.TestCsv;

    /// <summary>The search's folder copied (store, tables, models, prediction file), so a test may change it.</summary>
    private string CopyOfSearch()
    {
        string target = copy.PathOf("out");
        foreach (string file in Directory.GetFiles(run.Result.OutDir, "*", SearchOption.AllDirectories))
        {
            string to = Path.Combine(target, Path.GetRelativePath(run.Result.OutDir, file));
            Directory.CreateDirectory(Path.GetDirectoryName(to)!);
            File.Copy(file, to);
        }

        return target;
    }

    /// <summary>A numeric feature the search kept after screening.</summary>
    private string KeptFeature()
    {
        using var store = SearchStore.OpenReadOnly(StoreFile.PathIn(run.Result.OutDir));
        return store.LoadScreening()!.Kept[0];
    }

    private string WithoutColumn(string name)
    {
        var lines = File.ReadAllLines(TestCsv);
        int column = Array.IndexOf(lines[0].Split(','), name);
        Assert.True(column >= 0, $"the test table has a column {name}");
        string rows = copy.PathOf("rows.csv");
        File.WriteAllLines(rows, lines.Select(l => string.Join(',', l.Split(',').Where((_, i) => i != column))));
        return rows;
    }

    private static (string Header, List<(string Id, double Value)> Rows) ReadPredictions(string path)
    {
        var lines = File.ReadAllLines(path);
        return (lines[0], [.. lines.Skip(1).Select(l => l.Split(',')).Select(c => (c[0], double.Parse(c[1], System.Globalization.CultureInfo.InvariantCulture)))]);
    }
}
