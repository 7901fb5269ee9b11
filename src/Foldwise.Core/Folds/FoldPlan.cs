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
        var rows = ImmutableArray.CreateBuilder<int>();
        for (int r = 0; r < FoldOfRow.Length; r++)
        {
            if ((FoldOfRow[r] == fold) == heldOut)
            {
                rows.Add(r);
            }
        }

        return rows.ToImmutable();
    }
}
