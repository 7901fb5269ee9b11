using Foldwise.Core.Proposers;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Schedules;

/// <summary>
/// One family's run of one Hyperband bracket, rebuilt from observed trials: per rung how many trials were
/// created and finished, its results in (score, id) order and which of them were promoted. Rung i+1 holds the top
/// min(n_{i+1}, results at rung i) of rung i and starts only when every trial of rung i has finished.
/// </summary>
internal sealed class BracketRun
{
    private readonly HyperbandBracket _bracket;
    private readonly int[] _created;
    private readonly int[] _finished;
    private readonly List<(double Score, int Id, ParameterSet Parameters)>[] _results;
    private readonly HashSet<int> _promoted = [];

    public BracketRun(HyperbandBracket bracket)
    {
        _bracket = bracket;
        int rungs = bracket.Rungs.Length;
        _created = new int[rungs];
        _finished = new int[rungs];
        _results = new List<(double, int, ParameterSet)>[rungs];
        for (int i = 0; i < rungs; i++)
        {
            _results[i] = [];
        }
    }

    /// <summary>Trials created in this run so far; families with fewer go first, which interleaves them.</summary>
    public int Created => _created.Sum();

    public void Observe(TrialRecord trial, TrialChange change)
    {
        int i = trial.Rung;
        if (i < 0 || i >= _created.Length)
        {
            return;
        }

        if (change.Created)
        {
            _created[i]++;
            if (trial.ParentId is int parent)
            {
                _promoted.Add(parent);
            }
        }

        if (change.Finished)
        {
            _finished[i]++;
            if (trial.State == TrialState.Done && trial.Score is double score && double.IsFinite(score))
            {
                var list = _results[i];
                var entry = (score, trial.Id, trial.Parameters);
                int at = list.FindIndex(e => e.Score > score || (e.Score == score && e.Id > trial.Id));
                list.Insert(at < 0 ? list.Count : at, entry);
            }
        }
    }

    public BracketStep Next()
    {
        var rungs = _bracket.Rungs;
        for (int i = 0; i < rungs.Length; i++)
        {
            int target = i == 0 ? rungs[0].Count : Math.Min(rungs[i].Count, _results[i - 1].Count);
            if (_created[i] < target)
            {
                if (i == 0)
                {
                    return new BracketStep(BracketStepKind.New, 0, rungs[0].Budget);
                }

                // The best of the previous rung's top `target` that has no child yet.
                var below = _results[i - 1];
                for (int r = 0; r < target; r++)
                {
                    if (!_promoted.Contains(below[r].Id))
                    {
                        return new BracketStep(BracketStepKind.Promote, i, rungs[i].Budget, below[r].Id, below[r].Parameters);
                    }
                }

                // Children were created for trials outside the top (not by this schedule): take the rung as filled.
            }

            if (_finished[i] < _created[i])
            {
                return new BracketStep(BracketStepKind.Waiting, i, rungs[i].Budget);
            }

            if (target == 0)
            {
                break;
            }
        }

        return new BracketStep(BracketStepKind.Complete, rungs.Length - 1, rungs[^1].Budget);
    }
}
