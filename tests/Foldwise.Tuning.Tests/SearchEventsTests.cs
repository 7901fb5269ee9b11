using Foldwise.Core.Events;

namespace Foldwise.Tuning.Tests;

/// <summary>What the use case reports while it runs, read by the command line and by anyone following a search.</summary>
[Collection(QuickDemoCollection.Name)]
public sealed class SearchEventsTests(QuickDemoRun run)
{
    [Fact]
    public void Reports_preparation_then_each_trial_then_the_stop_then_the_blend_in_that_order()
    {
        // Given a finished run of the quick demo
        var seen = run.Events.Seen.Where(e => e is not (SlotTrialScored or TrialStarted or CandidatePromoted or SlotFoldFitted or StepProgress)).Select(e => e.GetType()).ToList();

        // Then the tables are read and screened before the search starts, every trial is scored before the stop,
        // the blend comes next, and the blend members' models are kept last
        Assert.Equal(
            [typeof(TablesRead), typeof(ColumnsScreened), typeof(SearchStarted), .. Enumerable.Repeat(typeof(TrialScored), 10), typeof(SearchStopped), typeof(BlendSolved), typeof(ModelsKept)],
            seen);
    }

    [Fact]
    public void Reports_each_fold_of_each_trial_in_order_before_the_trial_is_scored()
    {
        // Given a finished run of the quick demo (3 folds)
        var seen = run.Events.Seen;

        // Then every trial reports folds 0, 1, 2 of 3, and its last fold comes before its score
        foreach (int trial in Enumerable.Range(1, 10))
        {
            var folds = seen.OfType<SlotFoldFitted>().Where(f => f.TrialId == trial).ToList();
            Assert.Equal([0, 1, 2], folds.Select(f => f.Fold).ToArray());
            Assert.All(folds, f => Assert.Equal(3, f.Folds));
            int lastFold = seen.ToList().IndexOf(folds[^1]);
            int scored = seen.ToList().FindIndex(e => e is TrialScored t && t.Trial.Id == trial);
            Assert.True(lastFold < scored, $"trial {trial}: last fold at {lastFold}, scored at {scored}");
        }
    }

    [Fact]
    public void Reports_each_trial_started_and_scored_and_each_promotion_with_its_parent()
    {
        // Given a finished run of the quick demo (trials 6, 8 and 10 retrain 3, 7 and 9 at 30 rounds)
        var started = run.Events.OfType<TrialStarted>();
        var scored = run.Events.OfType<TrialScored>();
        var promoted = run.Events.OfType<CandidatePromoted>();

        // Then each trial starts once and is scored once, with the score the store keeps
        Assert.Equal(Enumerable.Range(1, 10), started.Select(e => e.Trial.Id));
        Assert.Equal(run.Trials.Select(t => (t.Id, t.Score)), scored.Select(e => (e.Trial.Id, e.Trial.Score)));
        Assert.Equal(10, scored[^1].Progress.Done);

        // And each promotion names the trial it retrains
        Assert.Equal([(6, 3), (8, 7), (10, 9)], promoted.Select(e => (e.Trial.Id, e.Trial.ParentId ?? 0)));

        // And the blend reports the summary the result returns, and where it wrote the predictions
        var blend = Assert.Single(run.Events.OfType<BlendSolved>());
        Assert.Same(run.Result.Blend, blend.Summary);
        Assert.Equal(run.Result.PredictionFile, blend.PredictionFile);
        Assert.Equal(3_200, blend.Predictions);
    }
}
