namespace Foldwise.Core.Blending;

/// <summary>
/// Which trials predict the test table: only those the blend may weight. The blend pool takes full-budget trials
/// (<see cref="BlendPool"/>); when none has finished, the blend falls back to the furthest budget reached, so until a
/// full-budget trial is done every trial predicts the test table. Below the full budget that saves the test scoring.
/// Budgets are each family's own: the coordinator asks with the trial's family's full budget and whether that family
/// has a full-budget trial done. A trial a fold screen runs on some folds only never enters the blend, so never predicts.
/// </summary>
public static class TestPredictions
{
    public static bool Wanted(int budget, int fullBudget, bool fullBudgetTrialDone, bool allFolds = true) =>
        allFolds && (budget >= fullBudget || !fullBudgetTrialDone);
}
