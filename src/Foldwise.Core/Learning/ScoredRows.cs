namespace Foldwise.Core.Learning;

/// <summary>
/// The rows a trial is scored on: every row when all folds train, else the held-out rows of the plan's first folds
/// only, so that trials screened on the same folds are scored on the same rows.
/// </summary>
internal sealed class ScoredRows
{
    private readonly TrialData data;
    private readonly int[]? rows;
    private readonly double[]? target;

    /// <summary>The scored rows' predictions, refilled at every round of the trial.</summary>
    private readonly double[]? predicted;

    private ScoredRows(TrialData data, int foldCount, int[]? rows)
    {
        this.data = data;
        FoldCount = foldCount;
        this.rows = rows;
        target = rows is null ? null : [.. rows.Select(r => data.Target[r])];
        predicted = rows is null ? null : new double[rows.Length];
    }

    /// <summary>Folds that train: the plan's first ones.</summary>
    public int FoldCount { get; }

    public static ScoredRows Of(TrialData data, int foldCount) =>
        foldCount == data.Folds.FoldCount
            ? new ScoredRows(data, foldCount, null)
            : new ScoredRows(data, foldCount, [.. Enumerable.Range(0, foldCount).SelectMany(f => data.Folds.ValidationRows(f).ToArray()).Order()]);

    /// <summary>The metric over the scored rows of <paramref name="outOfFold"/> (a vector over every training row).</summary>
    public double Score(double[] outOfFold)
    {
        if (rows is null)
        {
            return data.Metric.Score(data.Target, outOfFold);
        }

        for (int i = 0; i < rows.Length; i++)
        {
            predicted![i] = outOfFold[rows[i]];
        }

        return data.Metric.Score(target!, predicted!);
    }
}
