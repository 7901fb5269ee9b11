using Foldwise.Core.Learning;

namespace Foldwise.Core.Tests.Learning;

public sealed class RoundStoppingTests
{
    [Theory]
    [InlineData(20, 10)]
    [InlineData(100, 10)]
    [InlineData(180, 18)]
    [InlineData(400, 40)]
    public void Waits_a_tenth_of_the_budget_but_never_fewer_than_ten_rounds(int budget, int patience) =>
        Assert.Equal(patience, RoundStopping.Default.Patience(budget));

    [Fact]
    public void Stops_once_the_patience_has_passed_without_a_better_round()
    {
        // Given a 180-round trial whose best round so far is 50 (patience 18)
        var stopping = RoundStopping.Default;

        // Then it trains on through round 67 and stops at round 68
        Assert.False(stopping.Stops(round: 67, bestRound: 50, budget: 180));
        Assert.True(stopping.Stops(round: 68, bestRound: 50, budget: 180));
    }

    [Fact]
    public void Stops_at_the_budget_even_while_still_improving() =>
        Assert.True(RoundStopping.Default.Stops(round: 20, bestRound: 20, budget: 20));

    [Fact]
    public void A_tie_keeps_the_earlier_round()
    {
        Assert.False(RoundStopping.Improves(0.5, 0.5));
        Assert.True(RoundStopping.Improves(0.49, 0.5));
    }
}
