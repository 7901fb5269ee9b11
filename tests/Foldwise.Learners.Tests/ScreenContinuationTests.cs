using Foldwise.Core.Learning;
using Foldwise.Core.Spaces;

namespace Foldwise.Learners.Tests;

public sealed class ScreenContinuationTests
{
    private static readonly TrialData Data = TinyTables.Data(rows: 300, testRows: 60, folds: 3);

    /// <summary>Large steps on a small table, with row bagging: the held-out score turns worse well before 200 rounds.</summary>
    private static ParameterSet Overfitting => new(TinyTables.Parameters(FamilyNames.LightGbm, rowFraction: 0.8).Values
        .SetItem("learning_rate", 0.4).SetItem("leaves", 31).SetItem("min_leaf_rows", 2).SetItem("l2", 0.0));

    /// <param name="seed">1: the screen stops at 27 rounds and the promotion trains its first fold on to 64; 4: the screen trained 51 and the promotion stops at 34, within them.</param>
    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    public void A_promotion_that_continues_its_screens_LightGBM_fold_equals_training_every_fold_again(int seed)
    {
        // Given a candidate screened on the first fold by native LightGBM, its booster kept by the worker
        using var screens = new ScreenedFits();
        var learner = new LightGbmLearner();
        var executor = new TrialExecutor(learner, RoundStopping.Default, screens);
        var screened = executor.Run(Data, Overfitting, budget: 200, seed, threads: 1, CancellationToken.None, predictsTest: false, folds: 1, lineage: new TrialLineage(3, null));

        // When its promotion to every fold continues that booster, and the same trial trains every fold afresh
        var promoted = executor.Run(Data, Overfitting, budget: 200, seed, threads: 1, CancellationToken.None, lineage: new TrialLineage(8, 3));
        var again = new TrialExecutor(learner).Run(Data, Overfitting, budget: 200, seed, threads: 1, CancellationToken.None);

        // Then the screen's rounds were taken over, not trained again, and every number reported is the same to the bit:
        // a booster paused and continued trains (bags included) as one never paused
        Assert.Equal(seed == 1, promoted.RoundsTrained > screened.RoundsTrained);
        Assert.Equal(Math.Min(screened.RoundsTrained, promoted.RoundsTrained), promoted.RoundsContinued);
        Assert.Equal(again.BestRound, promoted.BestRound);
        Assert.Equal(again.RoundsTrained, promoted.RoundsTrained);
        Assert.Equal(again.Score, promoted.Score);
        Assert.Equal(again.OutOfFold, promoted.OutOfFold);
        Assert.Equal(again.Test, promoted.Test);
    }
}
