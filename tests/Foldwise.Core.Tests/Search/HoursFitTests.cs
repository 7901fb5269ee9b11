using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Search;

public sealed class HoursFitTests
{
    private static readonly DateTimeOffset Start = new(2026, 12, 1, 9, 0, 0, TimeSpan.Zero);

    private static TrialRecord Done(int id, int budget, double seconds, string family = "lightgbm", int folds = 0, int continued = 0) => new()
    {
        Id = id,
        Family = family,
        Parameters = ParameterSet.Of(new Dictionary<string, double>()),
        Budget = budget,
        Folds = folds,
        Proposer = "random",
        State = TrialState.Done,
        Created = Start,
        Started = Start,
        Finished = Start.AddSeconds(seconds),
        RoundsContinued = continued,
    };

    private static TrialRecord Next(int budget, string family = "lightgbm", int folds = 0) =>
        Done(99, budget, 0, family, folds) with { State = TrialState.Queued, Started = null, Finished = null };

    [Fact]
    public void A_trial_starts_when_the_search_has_no_hours_budget_or_its_family_nothing_done()
    {
        var fastTree = new[] { Done(1, 180, 5000, "fasttree") };

        Assert.True(HoursFit.Fits(Next(180), spentSeconds: 3599, hours: null, fastTree, folds: 5));
        Assert.True(HoursFit.Fits(Next(180), spentSeconds: 3599, hours: 1, fastTree, folds: 5));
    }

    [Fact]
    public void A_trial_starts_only_if_its_familys_median_time_for_the_same_budget_ends_within_the_hours()
    {
        // Given three done trials of its budget and folds taking 100, 120 and 300 s (median 120 s), and a slow one at another budget
        var trials = new[] { Done(1, 180, 100), Done(2, 180, 300), Done(3, 180, 120), Done(4, 20, 900) };

        // Then it starts with 130 s left and not with 110 s left
        Assert.True(HoursFit.Fits(Next(180), spentSeconds: 3600 - 130, hours: 1, trials, folds: 5));
        Assert.False(HoursFit.Fits(Next(180), spentSeconds: 3600 - 110, hours: 1, trials, folds: 5));
    }

    [Fact]
    public void Without_a_trial_of_its_shape_done_it_scales_the_familys_time_per_budget_unit_and_fold()
    {
        // Given only screens of 180 rounds on one fold taking 20 s: 20 / 180 s per round and fold
        var trials = new[] { Done(1, 180, 20, folds: 1), Done(2, 180, 20, folds: 1) };

        // Then a trial of 180 rounds on all 5 folds is expected to take 100 s, and, from a promotion that took 80 s for the 720 it trained, a screen of 180 rounds 20 s
        Assert.True(HoursFit.Fits(Next(180), spentSeconds: 3600 - 101, hours: 1, trials, folds: 5));
        Assert.False(HoursFit.Fits(Next(180), spentSeconds: 3600 - 99, hours: 1, trials, folds: 5));
        var continued = new[] { Done(3, 180, 80, continued: 180) };
        Assert.True(HoursFit.Fits(Next(180, folds: 1), spentSeconds: 3600 - 21, hours: 1, continued, folds: 5));
        Assert.False(HoursFit.Fits(Next(180, folds: 1), spentSeconds: 3600 - 19, hours: 1, continued, folds: 5));
    }
}
