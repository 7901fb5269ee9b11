using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Testing.Fakes;

/// <summary>A schedule that proposes new full-budget candidates of one family, numbering a parameter, and records what it observed.</summary>
public sealed class CountingSchedule(string family = FamilyNames.LightGbm, int budget = 10) : ISchedule
{
    private int proposed;

    public List<TrialRecord> Observed { get; } = [];

    /// <summary>When set, the schedule proposes nothing (as if waiting on a rung).</summary>
    public bool Hold { get; set; }

    public bool Exhausted { get; set; }

    public void Observe(TrialRecord trial) => Observed.Add(trial);

    public TrialPlan? NextPlan()
    {
        if (Hold)
        {
            return null;
        }

        proposed++;
        return new TrialPlan(family, ParameterSet.Of([new("x", proposed)]), budget, 0, null, "counting");
    }
}
