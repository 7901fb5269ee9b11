using Foldwise.Core.Proposers;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

public sealed class RandomProposerTests
{
    private static readonly ParameterSpace Mixed = new(
    [
        ParameterRange.Whole("leaves", 8, 12),
        ParameterRange.Linear("fraction", 0.5, 1.0),
        ParameterRange.Log("l2", 1e-3, 10),
        ParameterRange.OneOf("kind", "gbdt", "dart", "goss"),
        ParameterRange.Fixed("rounds_per_tree", 1),
    ]);

    [Fact]
    public void Respects_every_kind_and_bound()
    {
        // Given 4,000 draws over a space with every kind
        var random = new Random(42);
        var draws = Enumerable.Range(0, 4000).Select(_ => RandomProposer.Draw(Mixed, random)).ToList();

        // Then every set is valid, whole numbers cover their inclusive range, choices all occur, fixed stays fixed
        Assert.All(draws, p => Assert.Empty(Mixed.Problems(p)));
        Assert.Equal([8, 9, 10, 11, 12], draws.Select(p => p["leaves"]).Distinct().Order());
        Assert.Equal([0, 1, 2], draws.Select(p => p["kind"]).Distinct().Order());
        Assert.All(draws, p => Assert.Equal(1, p["rounds_per_tree"]));
        Assert.All(draws, p => Assert.InRange(p["fraction"], 0.5, 1.0));

        // And the log-scaled range is even in log space: about half the draws fall below its geometric middle 0.1,
        // and about a quarter below 10^-2 (a uniform draw on [1e-3, 10] would put 1% below 0.1)
        Assert.InRange(draws.Count(p => p["l2"] < 0.1) / 4000.0, 0.47, 0.53);
        Assert.InRange(draws.Count(p => p["l2"] < 0.01) / 4000.0, 0.22, 0.28);

        // And whole-number values are even: each of the five leaves values near a fifth
        Assert.All(draws.GroupBy(p => p["leaves"]), g => Assert.InRange(g.Count() / 4000.0, 0.17, 0.23));
    }

    [Fact]
    public void Names_itself_on_its_proposals_and_ignores_history()
    {
        var history = new FamilyHistory("f", Mixed);

        var proposal = new RandomProposer().Propose(history, new Random(1));

        Assert.Equal("random", proposal.Proposer);
        Assert.Equal(RandomProposer.Draw(Mixed, new Random(1)), proposal.Parameters);
    }
}
