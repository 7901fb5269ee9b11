using Foldwise.Core.Search;
using Foldwise.Core.Spaces;

namespace Foldwise.Testing.Fakes;

/// <summary>A schedule that proposes new candidates of one family at a budget (settable), numbering a parameter, and records what it observed.</summary>
public sealed class CountingSchedule(string family = FamilyNames.LightGbm, int budget = 10) : ISchedule
{
    private int proposed;

    public List<TrialRecord> Observed { get; } = [];

    /// <summary>When set, the schedule proposes nothing (as if waiting on a rung).</summary>
    public bool Hold { get; set; }

    public bool Exhausted { get; set; }

    /// <summary>The budget of the trials proposed from now on.</summary>
    public int Budget { get; set; } = budget;

    /// <summary>The family of the trials proposed from now on.</summary>
    public string Family { get; set; } = family;

    /// <summary>The folds each next plan trains (0: all), as a schedule that screens on folds would set.</summary>
    public int Folds { get; set; }

    public void Observe(TrialRecord trial) => Observed.Add(trial);

    public TrialPlan? NextPlan()
    {
        if (Hold)
        {
            return null;
        }

        proposed++;
        return new TrialPlan(Family, ParameterSet.Of([new("x", proposed)]), Budget, 0, null, "counting", Folds: Folds);
    }
}
