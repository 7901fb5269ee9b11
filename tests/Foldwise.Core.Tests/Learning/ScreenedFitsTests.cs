using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;
using Foldwise.Testing;
using Foldwise.Testing.Fakes;

namespace Foldwise.Core.Tests.Learning;

public sealed class ScreenedFitsTests
{
    private static readonly TrialData Data = TinyTables.RampTrialData();

    /// <summary>The first fold is best after 10 rounds, the others after 30: a one-fold screen stops long before its promotion does.</summary>
    private static double EarlyFirstFold(int fold, int rounds) => 0.01 + (Math.Abs(rounds - (fold == 0 ? 10 : 30)) / 100.0);

    private static readonly ParameterSet Parameters = ParameterSet.Of([new("depth", 3)]);

    private static TrialOutcome Screen(CurveLearner learner, ScreenedFits screens, int trialId) =>
        new TrialExecutor(learner, RoundStopping.Default, screens).Run(
            Data, Parameters, budget: 100, seed: 1, threads: 1, CancellationToken.None, predictsTest: false, folds: 1, lineage: new TrialLineage(trialId, null));

    private static TrialOutcome Promote(CurveLearner learner, ScreenedFits? screens, int trialId, int parentId, int seed = 1) =>
        new TrialExecutor(learner, RoundStopping.Default, screens).Run(
            Data, Parameters, budget: 100, seed, threads: 1, CancellationToken.None, lineage: new TrialLineage(trialId, parentId));

    [Fact]
    public void A_promotion_continues_its_screens_fold_with_the_result_of_training_it_again()
    {
        // Given a candidate screened on the first fold, whose fold model a worker kept
        using var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);
        var screened = Screen(learner, screens, trialId: 4);

        // When its promotion to every fold runs on that worker, and the same promotion runs where nothing was kept
        var promoted = Promote(learner, screens, trialId: 9, parentId: 4);
        var again = Promote(new CurveLearner(EarlyFirstFold), screens: null, trialId: 9, parentId: 4);

        // Then the screen stopped at 20 rounds (best 10, patience 10) and the promotion took those over, training the
        // first fold further itself; everything it reports is what training every fold again reports
        Assert.Equal(20, screened.RoundsTrained);
        Assert.Equal(20, promoted.RoundsContinued);
        Assert.Equal(0, again.RoundsContinued);
        Assert.Equal(again.BestRound, promoted.BestRound);
        Assert.Equal(again.RoundsTrained, promoted.RoundsTrained);
        Assert.True(promoted.RoundsTrained > 20);
        Assert.Equal(again.Score, promoted.Score);
        Assert.Equal(again.FoldScores.AsEnumerable(), promoted.FoldScores.AsEnumerable());
        Assert.Equal(again.OutOfFold, promoted.OutOfFold);
        Assert.Equal(again.Test, promoted.Test);

        // And the promotion started only the four folds the screen had not trained, then freed every model
        Assert.Equal([0, 1, 2, 3, 4], learner.Fits.Select(f => f.Fold));
        Assert.All(learner.Fits, f => Assert.True(f.Disposed));
        Assert.Equal(0, screens.Count);
    }

    [Fact]
    public void A_screen_keeps_its_fold_model_undisposed_until_a_promotion_or_the_worker_ends()
    {
        // Given a screened trial kept by a worker
        var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);
        Screen(learner, screens, trialId: 4);

        // Then its model is alive while kept, and freed when the worker's keep ends
        Assert.Equal(1, screens.Count);
        Assert.False(learner.Fits.Single().Disposed);
        screens.Dispose();
        Assert.True(learner.Fits.Single().Disposed);
    }

    [Fact]
    public void A_promotion_fitted_otherwise_than_its_screen_trains_every_fold_again()
    {
        // Given a screened trial kept by a worker
        using var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);
        Screen(learner, screens, trialId: 4);

        // When its promotion arrives with another fit seed (so its first fold would not be the screen's fit)
        var promoted = Promote(learner, screens, trialId: 9, parentId: 4, seed: 2);

        // Then nothing is continued, and the screen's model is freed rather than kept for nobody
        Assert.Equal(0, promoted.RoundsContinued);
        Assert.Equal(6, learner.Fits.Count);
        Assert.All(learner.Fits, f => Assert.True(f.Disposed));
        Assert.Equal(0, screens.Count);
    }

    [Fact]
    public void A_worker_keeps_only_its_most_recent_screens_within_its_capacity()
    {
        // Given a keep for two trials
        using var screens = new ScreenedFits { CapacityTrials = 2 };
        var learner = new CurveLearner(EarlyFirstFold);

        // When three candidates are screened
        Screen(learner, screens, trialId: 1);
        Screen(learner, screens, trialId: 2);
        Screen(learner, screens, trialId: 3);

        // Then the oldest is freed, and its promotion trains every fold while the newest continues
        Assert.Equal(2, screens.Count);
        Assert.True(learner.Fits[0].Disposed);
        Assert.Equal(0, Promote(learner, screens, trialId: 10, parentId: 1).RoundsContinued);
        Assert.Equal(20, Promote(learner, screens, trialId: 11, parentId: 3).RoundsContinued);
    }

    [Fact]
    public void A_trial_on_every_fold_keeps_nothing()
    {
        // Given a keep and a trial that trains every fold
        using var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);

        // When it runs
        new TrialExecutor(learner, RoundStopping.Default, screens).Run(
            Data, Parameters, budget: 100, seed: 1, threads: 1, CancellationToken.None, lineage: new TrialLineage(5, null));

        // Then its models are freed at once
        Assert.Equal(0, screens.Count);
        Assert.All(learner.Fits, f => Assert.True(f.Disposed));
    }

    [Fact]
    public void A_screen_of_another_search_frees_the_screens_kept_for_the_last_one()
    {
        // Given a screen kept from one search
        using var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);
        Screen(learner, screens, trialId: 4);

        // When the worker screens a candidate of another search (another table)
        new TrialExecutor(learner, RoundStopping.Default, screens).Run(
            TinyTables.RampTrialData(), Parameters, budget: 100, seed: 1, threads: 1, CancellationToken.None, predictsTest: false, folds: 1, lineage: new TrialLineage(4, null));

        // Then only the new search's screen is kept, and the old one's model is freed
        Assert.Equal(1, screens.Count);
        Assert.True(learner.Fits[0].Disposed);
        Assert.False(learner.Fits[1].Disposed);
    }

    [Fact]
    public void A_promotion_cancelled_before_it_starts_frees_the_screens_models()
    {
        // Given a screened trial kept by a worker
        using var screens = new ScreenedFits();
        var learner = new CurveLearner(EarlyFirstFold);
        Screen(learner, screens, trialId: 4);

        // When its promotion is cancelled as it starts
        using var cancelled = new CancellationTokenSource();
        cancelled.Cancel();
        Assert.Throws<OperationCanceledException>(() => new TrialExecutor(learner, RoundStopping.Default, screens).Run(
            Data, Parameters, budget: 100, seed: 1, threads: 1, cancelled.Token, lineage: new TrialLineage(9, 4)));

        // Then the screen's model is freed, not left to nobody
        Assert.True(learner.Fits.Single().Disposed);
        Assert.Equal(0, screens.Count);
    }
}
