using Foldwise.Core.Folds;

namespace Foldwise.Bench.FoldFit;

/// <summary>Plain shuffled K-fold for the bench only: rows in a seeded random order, dealt out in turn.</summary>
internal static class SeededKFold
{
    public static FoldPlan Plan(int rows, int folds, int seed)
    {
        var order = Enumerable.Range(0, rows).ToArray();
        new Random(seed).Shuffle(order);
        var foldOfRow = new int[rows];
        for (int i = 0; i < rows; i++)
        {
            foldOfRow[order[i]] = i % folds;
        }

        return new FoldPlan(folds, seed, [.. foldOfRow]);
    }
}
