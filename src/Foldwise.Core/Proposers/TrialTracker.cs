using Foldwise.Core.Search;

namespace Foldwise.Core.Proposers;

/// <summary>
/// Remembers each trial's last state so a record observed twice (or out of its usual order) changes nothing twice.
/// Done and Failed are final: later records of a finished trial are ignored.
/// </summary>
internal sealed class TrialTracker
{
    private readonly Dictionary<int, TrialState> _states = [];

    public int Count => _states.Count;

    public TrialChange Observe(TrialRecord trial)
    {
        bool known = _states.TryGetValue(trial.Id, out var previous);
        if (known && IsFinal(previous))
        {
            return TrialChange.None;
        }

        _states[trial.Id] = trial.State;
        return new TrialChange(Created: !known, Finished: IsFinal(trial.State));
    }

    public static bool IsFinal(TrialState state) => state is TrialState.Done or TrialState.Failed;
}
