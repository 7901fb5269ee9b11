using System.Collections.ObjectModel;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>
/// What one family has shown so far, kept up to date from trial records: finished results per budget and folds
/// (<see cref="TrialReach"/>, in the order they finished) and the new candidates still queued or running. Promotions add results at
/// their budget but are not pending candidates: their point is already known from a lower budget.
/// </summary>
public sealed class FamilyHistory
{
    private readonly TrialTracker _tracker = new();
    private readonly SortedList<TrialReach, List<Observation>> _results = [];
    private readonly SortedDictionary<int, double[]> _pending = [];
    private readonly Dictionary<int, int> _candidates = [];
    private readonly SortedList<int, (TrialReach Reach, Observation Result)> _furthest = [];
    private readonly ReadOnlyCollection<TrialReach> _budgets;

    public FamilyHistory(string family, ParameterSpace space)
    {
        Family = family;
        Space = space;
        _budgets = new ReadOnlyCollection<TrialReach>(_results.Keys);
    }

    public string Family { get; }

    public ParameterSpace Space { get; }

    /// <summary>New candidates (trials without a parent) observed so far, finished or not.</summary>
    public int NewCandidates { get; private set; }

    /// <summary>Budgets (with folds) that have at least one result, ascending.</summary>
    public IReadOnlyList<TrialReach> Budgets => _budgets;

    /// <summary>Values of new candidates not yet finished, by trial id.</summary>
    public IReadOnlyCollection<double[]> Pending => _pending.Values;

    /// <summary>Finished results at every budget.</summary>
    public int Results { get; private set; }

    /// <summary>
    /// Each candidate once, at the highest budget (then folds) it has a result at (its <see cref="Observation.TrialId"/> is the trial
    /// that started it), oldest candidate first: the most recent ones are at the end, without a sort.
    /// </summary>
    public IList<(TrialReach Reach, Observation Result)> Furthest => _furthest.Values;

    /// <summary>Results at a budget on every fold, oldest first; empty when there are none.</summary>
    public IReadOnlyList<Observation> ResultsAt(int budget) => ResultsAt(TrialReach.Whole(budget));

    /// <summary>Results at a budget and folds, oldest first; empty when there are none.</summary>
    public IReadOnlyList<Observation> ResultsAt(TrialReach reach) =>
        _results.TryGetValue(reach, out var list) ? list : [];

    /// <summary>Takes in a created trial or a change of state; records of other families are the caller's to filter.</summary>
    public TrialChange Observe(TrialRecord trial)
    {
        var change = _tracker.Observe(trial);
        if (change.Created)
        {
            _candidates[trial.Id] = trial.ParentId is int parent ? CandidateOf(parent) : trial.Id;
        }

        if (change.Created && trial.ParentId is null)
        {
            NewCandidates++;
            if (!change.Finished)
            {
                _pending[trial.Id] = Encode(trial.Parameters);
            }
        }

        if (change.Finished)
        {
            _pending.Remove(trial.Id);
            if (trial.State == TrialState.Done && trial.Score is double score && double.IsFinite(score))
            {
                var reach = TrialReach.Of(trial);
                if (!_results.TryGetValue(reach, out var list))
                {
                    list = [];
                    _results.Add(reach, list);
                }

                var result = new Observation(trial.Id, Encode(trial.Parameters), score);
                list.Add(result);
                Results++;
                int candidate = CandidateOf(trial.Id);
                if (!_furthest.TryGetValue(candidate, out var known) || known.Reach <= reach)
                {
                    _furthest[candidate] = (reach, result with { TrialId = candidate });
                }
            }
        }

        return change;
    }

    /// <summary>The trial that started <paramref name="trialId"/>'s candidate (itself when it is new or unknown).</summary>
    public int CandidateOf(int trialId) => _candidates.TryGetValue(trialId, out int candidate) ? candidate : trialId;

    /// <summary>The values in the space's order; a name the set lacks takes the range's low end.</summary>
    public double[] Encode(ParameterSet parameters)
    {
        var ranges = Space.Ranges;
        var values = new double[ranges.Length];
        for (int i = 0; i < values.Length; i++)
        {
            values[i] = parameters.Get(ranges[i].Name, ranges[i].Low);
        }

        return values;
    }
}
