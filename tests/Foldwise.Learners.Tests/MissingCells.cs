using Foldwise.Core.Data;
using Foldwise.Core.Learning;
using Foldwise.Core.Metrics;

namespace Foldwise.Learners.Tests;

/// <summary>One feature that is NaN (missing), absent (zero) or 1 in turn, with targets 10, 0 and 5 (RMSE, unlogged); 4 folds, so every fold holds all three.</summary>
internal static class MissingCells
{
    public static double Target(int row) => (row % 3) switch { 0 => 10, 1 => 0, _ => 5 };

    public static TrialData Data(int rows)
    {
        var present = Enumerable.Range(0, rows).Where(r => r % 3 != 1).ToArray();
        var column = new SparseColumn([.. present], [.. present.Select(r => r % 3 == 0 ? float.NaN : 1f)]);
        var train = SparseRowMatrix.FromColumns(rows, [column]);
        var test = SparseRowMatrix.FromColumns(3, [new SparseColumn([0, 2], [float.NaN, 1f])]);
        return new TrialData(train, [.. Enumerable.Range(0, rows).Select(Target)], test, TinyTables.RoundRobin(rows, 4), Metric.Rmse);
    }
}
