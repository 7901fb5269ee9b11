using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Foldwise.Storage.Writer;

namespace Foldwise.Storage.Tests;

public sealed class TrialRecordTests : IDisposable
{
    private readonly TempDirectory _dir = new();

    public void Dispose() => _dir.Dispose();

    [Fact]
    public void Round_trips_a_done_trial_with_every_field_set()
    {
        // Given a trial with parameters, parent, lease, times with an offset and sub-millisecond ticks
        var trial = SampleTrials.Done(7);
        using var store = SearchStore.Create(_dir.StorePath);

        // When it is saved and loaded
        store.Save(trial);

        // Then every field comes back as it was
        Same.Trial(trial, store.LoadTrial(7));
    }

    [Fact]
    public void Round_trips_a_queued_trial_with_nulls_and_empty_arrays()
    {
        var trial = SampleTrials.Queued(1);
        using var store = SearchStore.Create(_dir.StorePath);

        store.Save(trial);

        var loaded = store.LoadTrial(1);
        Same.Trial(trial, loaded);
        Assert.Null(loaded!.ParentId);
        Assert.Null(loaded.Score);
        Assert.Null(loaded.LeaseExpires);
        Assert.Empty(loaded.Parameters.Values);
        Assert.Empty(loaded.FoldScores);
    }

    [Fact]
    public void Round_trips_a_failed_trial_with_a_reason_and_a_score_that_is_not_a_number()
    {
        var trial = SampleTrials.Done(3) with
        {
            State = TrialState.Failed,
            Score = double.NaN,
            FailureReason = "LightGBM: num_leaves must be > 1 — \"2\"\nsecond line",
            LostAttempts = ["1: lease expired on w2/0", "2: worker w3 stopped"],
        };
        using var store = SearchStore.Create(_dir.StorePath);

        store.Save(trial);

        Same.Trial(trial, store.LoadTrial(3));
    }

    [Fact]
    public void Stores_default_immutable_arrays_as_empty_ones()
    {
        var trial = SampleTrials.Queued(2) with { FoldScores = default, LostAttempts = default };
        using var store = SearchStore.Create(_dir.StorePath);

        store.Save(trial);

        var loaded = store.LoadTrial(2)!;
        Assert.False(loaded.FoldScores.IsDefault);
        Assert.Empty(loaded.FoldScores);
        Assert.False(loaded.LostAttempts.IsDefault);
        Assert.Empty(loaded.LostAttempts);
    }

    [Fact]
    public void Saving_a_trial_again_replaces_it()
    {
        using var store = SearchStore.Create(_dir.StorePath);
        store.Save(SampleTrials.Queued(5));

        var done = SampleTrials.Done(5);
        store.Save(done);

        Same.Trial(done, Assert.Single(store.LoadTrials()));
    }

    [Fact]
    public void Loads_trials_by_ascending_id_whatever_order_they_were_saved_in()
    {
        using var store = SearchStore.Create(_dir.StorePath);
        foreach (int id in new[] { 12, 3, 100, 1, 7 })
        {
            store.Save(SampleTrials.Done(id));
        }

        var ids = store.LoadTrials().Select(t => t.Id);

        Assert.Equal([1, 3, 7, 12, 100], ids);
    }

    [Fact]
    public void Loads_every_trial_when_they_fill_whole_pages_and_one_more()
    {
        // Given exactly two pages of trials, saved from the highest id down
        int count = 2 * SearchStore.TrialPage;
        using var store = SearchStore.Create(_dir.StorePath);
        for (int id = count; id >= 1; id--)
        {
            store.Save(SampleTrials.Queued(id));
        }

        // Then all load in order, and still do with one trial more
        Assert.Equal(Enumerable.Range(1, count), store.LoadTrials().Select(t => t.Id));
        store.Save(SampleTrials.Done(count + 1));
        Assert.Equal(Enumerable.Range(1, count + 1), store.LoadTrials().Select(t => t.Id));
    }

    [Fact]
    public void Returns_null_for_a_trial_never_saved_and_no_trials_for_a_new_store()
    {
        using var store = SearchStore.Create(_dir.StorePath);

        Assert.Null(store.LoadTrial(1));
        Assert.Empty(store.LoadTrials());
    }

    [Fact]
    public void Keeps_parameter_names_and_values_exactly()
    {
        var parameters = ParameterSet.Of(new Dictionary<string, double>
        {
            ["lambda_l2"] = 1e-300,
            ["bagging.fraction"] = 0.1 + 0.2,
            ["leaves"] = -0.0,
            ["max_bin"] = double.MaxValue,
        });
        using var store = SearchStore.Create(_dir.StorePath);

        store.Save(SampleTrials.Queued(1) with { Parameters = parameters });

        var loaded = store.LoadTrial(1)!.Parameters.Values;
        Assert.Equal(parameters.Values.Keys, loaded.Keys);
        Assert.All(parameters.Values, kv =>
            Assert.Equal(BitConverter.DoubleToInt64Bits(kv.Value), BitConverter.DoubleToInt64Bits(loaded[kv.Key])));
    }

    [Fact]
    public void Keeps_saved_trials_after_the_store_is_closed_and_opened_again()
    {
        using (var store = SearchStore.Create(_dir.StorePath))
        {
            store.Save(SampleTrials.Done(1));
            store.Save(SampleTrials.Done(2));
        }

        using var reopened = SearchStore.Open(_dir.StorePath);

        Same.Trial(SampleTrials.Done(2), reopened.LoadTrials()[1]);
    }

    [Fact]
    public void Refuses_parameter_names_that_differ_only_by_case()
    {
        // LiteDB's documents compare field names ignoring case, so storing both would silently keep one.
        var parameters = ParameterSet.Of(new Dictionary<string, double> { ["leaves"] = 31, ["Leaves"] = 63 });
        using var store = SearchStore.Create(_dir.StorePath);

        var error = Assert.Throws<StoreException>(() => store.Save(SampleTrials.Queued(1) with { Parameters = parameters }));

        Assert.Contains("'Leaves' and 'leaves'", error.Message);
        Assert.Null(store.LoadTrial(1));
    }
}
