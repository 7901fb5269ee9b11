using System.Collections.Immutable;

namespace Foldwise.Core.Folds;

/// <summary>
/// Which fold each training row is held out in. Stored with the search, so every trial
/// is scored on the same folds and out-of-fold predictions of different trials can be pooled.
/// </summary>
public sealed record FoldPlan(int FoldCount, int Seed, ImmutableArray<int> FoldOfRow)
{
    public int RowCount => FoldOfRow.Length;

    /// <summary>The rows a fold's model is trained on, ascending.</summary>
    public ImmutableArray<int> TrainRows(int fold) => Rows(fold, heldOut: false);

    /// <summary>The rows a fold's model predicts out of fold, ascending.</summary>
    public ImmutableArray<int> ValidationRows(int fold) => Rows(fold, heldOut: true);

    private ImmutableArray<int> Rows(int fold, bool heldOut)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(fold);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(fold, FoldCount);
        // Counted first, so the rows are written once into a vector of their size: a growing one left about three times
        // its size as garbage, 40 MB a fold of a 1,000,000-row table (bench/Foldwise.Bench.FoldFit --memory, 2026-12-05).
        int count = 0;
        foreach (int f in FoldOfRow)
        {
            count += (f == fold) == heldOut ? 1 : 0;
        }

        var rows = ImmutableArray.CreateBuilder<int>(count);
        for (int r = 0; r < FoldOfRow.Length; r++)
        {
            if ((FoldOfRow[r] == fold) == heldOut)
            {
                rows.Add(r);
            }
        }

        return rows.MoveToImmutable();
    }
}
