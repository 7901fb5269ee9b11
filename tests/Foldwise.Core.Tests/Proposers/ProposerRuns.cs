using System.Collections.Immutable;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Proposers;

/// <summary>Drives a proposer sequentially on a function, as a one-slot search would, and keeps every proposal.</summary>
internal static class ProposerRuns
{
    public static readonly DateTimeOffset Epoch = new(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);

    public static TrialRecord Done(int id, ParameterSet parameters, double score, int budget = 1, string family = "f") => new()
    {
        Id = id,
        Family = family,
        Parameters = parameters,
        Budget = budget,
        Proposer = "test",
        Created = Epoch,
        State = TrialState.Done,
        Score = score,
    };

    public static (double Best, ImmutableArray<ParameterSet> Proposed) Minimise(
        IProposer proposer, ParameterSpace space, Func<ParameterSet, double> f, int evaluations, int seed)
    {
        var history = new FamilyHistory("f", space);
        var proposed = ImmutableArray.CreateBuilder<ParameterSet>(evaluations);
        double best = double.PositiveInfinity;
        for (int i = 1; i <= evaluations; i++)
        {
            var p = proposer.Propose(history, new SearchSeeds(seed).Proposal(0, i)).Parameters;
            double y = f(p);
            best = Math.Min(best, y);
            proposed.Add(p);
            history.Observe(Done(i, p, y));
        }

        return (best, proposed.MoveToImmutable());
    }

    public static double MedianBest(IProposer proposer, ParameterSpace space, Func<ParameterSet, double> f, int evaluations, int seeds)
    {
        var bests = Enumerable.Range(1, seeds).Select(s => Minimise(proposer, space, f, evaluations, s).Best).Order().ToArray();
        return seeds % 2 == 1 ? bests[seeds / 2] : (bests[(seeds / 2) - 1] + bests[seeds / 2]) / 2;
    }
}
