using System.Runtime.InteropServices;

namespace Foldwise.Core.Folds;

/// <summary>
/// K-fold plans stratified on the target: rows are ordered by target (ties in seeded random order) and cut into
/// consecutive groups of K; each group's rows go to a seeded permutation of the K folds, and the last, short
/// group's rows to distinct folds picked at random. Every fold thus sees the whole target range, and fold
/// sizes differ by at most one.
/// </summary>
public static class StratifiedFoldPlanner
{
    public static FoldPlan Create(IReadOnlyList<double> targetOnFittingScale, int folds, int seed)
    {
        ArgumentNullException.ThrowIfNull(targetOnFittingScale);
        int rows = targetOnFittingScale.Count;
        if (folds < 2)
        {
            throw new ArgumentOutOfRangeException(nameof(folds), folds, "a fold plan needs at least 2 folds");
        }

        if (folds > rows)
        {
            throw new ArgumentOutOfRangeException(nameof(folds), folds, $"{folds} folds need at least {folds} rows, not {rows}");
        }

        if (targetOnFittingScale.Any(y => !double.IsFinite(y)))
        {
            throw new ArgumentException("every target must be a finite number", nameof(targetOnFittingScale));
        }

        var random = new Random(seed);
        var order = Enumerable.Range(0, rows).ToArray();
        random.Shuffle(order);

        // A stable sort after the shuffle leaves equal targets in random order.
        order = [.. order.OrderBy(r => targetOnFittingScale[r])];

        var foldOfRow = new int[rows];
        var foldOrder = Enumerable.Range(0, folds).ToArray();
        for (int start = 0; start < rows; start += folds)
        {
            random.Shuffle(foldOrder);
            int end = Math.Min(start + folds, rows);
            for (int k = start; k < end; k++)
            {
                foldOfRow[order[k]] = foldOrder[k - start];
            }
        }

        return new FoldPlan(folds, seed, ImmutableCollectionsMarshal.AsImmutableArray(foldOfRow));
    }
}
