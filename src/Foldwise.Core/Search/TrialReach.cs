namespace Foldwise.Core.Search;

/// <summary>
/// How far up a schedule's ladder a trial got: its budget, then its folds, a trial on every fold (<see cref="Folds"/> 0)
/// above any share of them. Orders results the same way whether rungs count rounds or folds.
/// </summary>
public readonly record struct TrialReach(int Budget, int Folds) : IComparable<TrialReach>
{
    public static TrialReach Of(TrialRecord trial)
    {
        ArgumentNullException.ThrowIfNull(trial);
        return new(trial.Budget, trial.Folds);
    }

    /// <summary>A budget trained on every fold.</summary>
    public static TrialReach Whole(int budget) => new(budget, 0);

    public int CompareTo(TrialReach other) =>
        Budget != other.Budget ? Budget.CompareTo(other.Budget) : FoldRank(Folds).CompareTo(FoldRank(other.Folds));

    public static bool operator <(TrialReach left, TrialReach right) => left.CompareTo(right) < 0;

    public static bool operator >(TrialReach left, TrialReach right) => left.CompareTo(right) > 0;

    public static bool operator <=(TrialReach left, TrialReach right) => left.CompareTo(right) <= 0;

    public static bool operator >=(TrialReach left, TrialReach right) => left.CompareTo(right) >= 0;

    private static int FoldRank(int folds) => folds == 0 ? int.MaxValue : folds;
}
