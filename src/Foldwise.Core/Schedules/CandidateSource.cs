using System.Collections.Immutable;
using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Search;

namespace Foldwise.Core.Schedules;

/// <summary>
/// The part every schedule shares: one <see cref="FamilyHistory"/> per family of the definition, and new candidates
/// drawn from the proposer with a random stream derived from the seed, the family and its candidate count.
/// </summary>
internal sealed class CandidateSource
{
    private readonly FamilyHistory[] _families;
    private readonly Dictionary<string, int> _index = new(StringComparer.Ordinal);
    private readonly IProposer _proposer;
    private readonly int _seed;

    public CandidateSource(ImmutableArray<FamilySearch> families, IProposer proposer, int seed)
    {
        if (families.IsDefaultOrEmpty)
        {
            throw new ArgumentException("a search needs at least one family", nameof(families));
        }

        _families = new FamilyHistory[families.Length];
        for (int i = 0; i < families.Length; i++)
        {
            if (!_index.TryAdd(families[i].Family, i))
            {
                throw new ArgumentException($"family '{families[i].Family}' appears twice", nameof(families));
            }

            _families[i] = new FamilyHistory(families[i].Family, families[i].Space);
        }

        _proposer = proposer;
        _seed = seed;
    }

    public int Count => _families.Length;

    public FamilyHistory this[int family] => _families[family];

    /// <summary>Routes a record to its family's history; the family index is −1 for a family the search does not have.</summary>
    public (int Family, TrialChange Change) Observe(TrialRecord trial)
    {
        if (!_index.TryGetValue(trial.Family, out int family))
        {
            return (-1, TrialChange.None);
        }

        return (family, _families[family].Observe(trial));
    }

    /// <summary>
    /// Which family the next new candidate belongs to: the one with the fewest new candidates so far, ties going to
    /// the earlier one in the definition. That is round-robin in definition order, so every family gets an equal
    /// share of new candidates, and it is read from observed trials only, so a resumed search picks the same family.
    /// </summary>
    public int NextFamily()
    {
        int best = 0;
        for (int f = 1; f < _families.Length; f++)
        {
            if (_families[f].NewCandidates < _families[best].NewCandidates)
            {
                best = f;
            }
        }

        return best;
    }

    /// <param name="rung">The rung the candidate starts at: 0 but in an ASHA bracket that starts higher.</param>
    /// <param name="folds">The folds it trains when the schedule screens on folds; 0: all.</param>
    public TrialPlan NewCandidate(int family, int budget, int bracket = 0, int rung = 0, int folds = 0)
    {
        var history = _families[family];
        var proposal = _proposer.Propose(history, new SearchSeeds(_seed).Proposal(family, history.NewCandidates));
        return new TrialPlan(history.Family, proposal.Parameters, budget, rung, ParentId: null, proposal.Proposer, bracket, folds);
    }
}
