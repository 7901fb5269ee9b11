using Foldwise.Core.Data;
using Foldwise.Core.Definition;
using Foldwise.Core.Folds;
using Foldwise.Core.Metrics;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Learning;

/// <summary>
/// Trains a tiny model of a family before a worker offers it (40 invented rows, 2 folds, 3 rounds): a machine whose
/// native library cannot load, or whose learner fails outright, finds out before it takes a lease instead of failing
/// real trials one after the other.
/// </summary>
public static class LearnerSelfTest
{
    private const int Rows = 40;

    private static readonly TrialData Tiny = CreateData();

    /// <summary>Null when the family trains on this machine; otherwise why not (the innermost error's message).</summary>
    public static string? Problem(IFoldLearner learner)
    {
        try
        {
            var outcome = new TrialExecutor(learner).Run(Tiny, ParametersFor(learner.Family), budget: 3, seed: 1, threads: 1, CancellationToken.None);
            return outcome.OutOfFold.All(double.IsFinite) ? null : "it predicted non-finite values on a tiny table";
        }
#pragma warning disable CA1031 // Any failure, whatever its type, means the family cannot be offered; the reason is kept.
        catch (Exception e)
#pragma warning restore CA1031
        {
            var inner = e;
            while (inner.InnerException is { } next)
            {
                inner = next;
            }

            return $"{inner.GetType().Name}: {inner.Message.Split('\n')[0].Trim()}";
        }
    }

    /// <summary>The middle of each default range, with leaf sizes the tiny folds allow; no parameters for a family without defaults.</summary>
    public static ParameterSet ParametersFor(string family)
    {
        if (!FamilyNames.All.Contains(family))
        {
            return ParameterSet.Empty;
        }

        var space = LeafSizeFit.ToRows(DefaultSpaces.For(family), Rows / 2);
        return ParameterSet.Of(space.Ranges.Select(r => KeyValuePair.Create(r.Name, Middle(r))));
    }

    private static double Middle(ParameterRange range) => range.Kind switch
    {
        ParameterKind.Log => Math.Sqrt(range.Low * range.High),
        ParameterKind.Whole or ParameterKind.OneOf => Math.Floor((range.Low + range.High) / 2),
        _ => (range.Low + range.High) / 2,
    };

    private static TrialData CreateData()
    {
        var starts = new int[Rows + 1];
        var columns = new List<int>();
        var values = new List<float>();
        var target = new double[Rows];
        for (int r = 0; r < Rows; r++)
        {
            columns.AddRange([0, 1, 2]);
            values.AddRange([r % 5, r % 3, (r * 7) % 11]);
            starts[r + 1] = columns.Count;
            target[r] = Math.Log(2 + (r % 5) + (0.5 * (r % 3)));
        }

        var matrix = new SparseRowMatrix(Rows, 3, starts, [.. columns], [.. values]);
        var folds = new FoldPlan(2, 1, [.. Enumerable.Range(0, Rows).Select(r => r % 2)]);
        return new TrialData(matrix, target, matrix, folds, Metric.Rmsle);
    }
}
