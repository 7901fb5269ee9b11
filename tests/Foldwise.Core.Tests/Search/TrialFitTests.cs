using Foldwise.Core.Definition;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Search;

public sealed class TrialFitTests
{
    private static readonly SearchDefinition Definition = new()
    {
        Name = "test",
        Data = new DataSource("train.csv", "test.csv", "id", "y"),
        Families = [new FamilySearch(FamilyNames.LightGbm, DefaultSpaces.LightGbm)],
        Budget = new SearchBudget(10, null),
    };

    private static TrialRecord Trial(int? bestRound) => new()
    {
        Id = 4,
        Family = FamilyNames.LightGbm,
        Parameters = ParameterSet.Of([new("learning_rate", 0.05)]),
        Budget = Definition.Schedule.FullBudget,
        Proposer = "tpe",
        State = TrialState.Done,
        Created = DateTimeOffset.UnixEpoch,
        BestRound = bestRound,
    };

    [Fact]
    public void A_trial_that_stopped_at_its_best_round_is_refitted_with_that_many_rounds()
    {
        var trial = Trial(bestRound: 137);

        var refit = TrialFit.Refit(trial, new Dictionary<int, TrialRecord> { [4] = trial }, Definition);

        Assert.Equal(137, refit.Budget);
        Assert.Equal(TrialFit.For(trial, new Dictionary<int, TrialRecord> { [4] = trial }, Definition) with { Budget = 137 }, refit);
    }

    [Fact]
    public void A_trial_without_a_best_round_is_refitted_with_its_budget_and_one_that_kept_none_with_one_round()
    {
        var whole = Trial(bestRound: null);
        var none = Trial(bestRound: 0);

        Assert.Equal(whole.Budget, TrialFit.Refit(whole, new Dictionary<int, TrialRecord> { [4] = whole }, Definition).Budget);
        Assert.Equal(1, TrialFit.Refit(none, new Dictionary<int, TrialRecord> { [4] = none }, Definition).Budget);
    }
}
