using System.Collections.Immutable;
using Foldwise.Core.Metrics;

namespace Foldwise.Core.Blending;

/// <summary>
/// The final stage: solves blend weights on the pool's pooled out-of-fold predictions (simplex by
/// default), scores the blend in sample, and gives the honest figure beside it — the nested estimate,
/// where each fold is predicted with weights fitted on the other folds' rows only. Weights always
/// minimise squared error on the fitting scale; the metric (RMSLE, RMSE or MAE) only scores them.
/// </summary>
public static class BlendStage
{
    /// <summary>Rounds of greedy selection, so its weights are multiples of 1/100 (a choice made here, not from a source).</summary>
    public const int GreedyRounds = 100;

    /// <summary>Solves and scores the blend; a pool of one gets weight 1 in every mode.</summary>
    public static BlendResult Run(BlendInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        if (input.Pool is null || input.Pool.Count == 0)
        {
            throw new InvalidOperationException("the blend pool is empty: no done full-budget trial to blend");
        }

        var target = input.Target;
        var columns = input.Pool.Select(c => c.OutOfFold).ToArray();
        BlendColumns.Validated(columns, target);
        var foldRows = FoldRows(input, target.Length);
        var metric = input.Metric;

        double[] weights;
        var nestedWeights = new double[foldRows.Length][];
        if (columns.Length == 1)
        {
            weights = [1.0];
            for (int f = 0; f < nestedWeights.Length; f++)
            {
                nestedWeights[f] = [1.0];
            }
        }
        else
        {
            var grams = FoldGrams.For(input.Options.Mode, GreedyRounds, columns, target, foldRows);
            weights = grams.SolveAll();
            for (int f = 0; f < foldRows.Length; f++)
            {
                nestedWeights[f] = grams.SolveWithout(f);
            }
        }

        var blended = Combine(weights, columns);
        var nested = new double[target.Length];
        var foldScores = ImmutableArray.CreateBuilder<double>(foldRows.Length);
        for (int f = 0; f < foldRows.Length; f++)
        {
            var fold = Combine(nestedWeights[f], columns);
            var rows = foldRows[f];
            var actual = new double[rows.Length];
            var predicted = new double[rows.Length];
            for (int i = 0; i < rows.Length; i++)
            {
                actual[i] = target[rows[i]];
                predicted[i] = nested[rows[i]] = fold[rows[i]];
            }

            foldScores.Add(metric.Score(actual, predicted));
        }

        var (bestId, bestScore) = BestSingle(input.Pool, target, metric);
        var members = input.Pool.Select((c, j) => new BlendMember(c.TrialId, c.Family, weights[j])).ToImmutableArray();
        var summary = new BlendSummary(
            input.Options.Mode,
            members,
            metric.Score(target, blended),
            metric.Score(target, nested),
            foldScores.MoveToImmutable(),
            bestId,
            bestScore);
        return new BlendResult(summary, weights, nestedWeights, blended, nested);
    }

    /// <summary>
    /// Σ wⱼ vectorⱼ on the fitting scale, e.g. the blended test predictions from each trial's mean of
    /// fold models; the caller maps the result back with <see cref="Metric.Inverse"/>.
    /// </summary>
    public static double[] Combine(IReadOnlyList<double> weights, IReadOnlyList<double[]> vectors)
    {
        ArgumentNullException.ThrowIfNull(weights);
        ArgumentNullException.ThrowIfNull(vectors);
        if (vectors.Count == 0 || weights.Count != vectors.Count)
        {
            throw new ArgumentException($"{weights.Count} weights for {vectors.Count} vectors; need one each, at least one");
        }

        int length = vectors[0].Length;
        if (vectors.Any(v => v.Length != length))
        {
            throw new ArgumentException("the vectors to combine differ in length", nameof(vectors));
        }

        return BlendColumns.Combine(weights, vectors, length);
    }

    private static int[][] FoldRows(BlendInput input, int rowCount)
    {
        var folds = input.Folds;
        if (folds.RowCount != rowCount)
        {
            throw new ArgumentException($"the fold plan covers {folds.RowCount} rows, the target {rowCount}", nameof(input));
        }

        if (folds.FoldCount < 2)
        {
            throw new ArgumentException("the nested estimate needs at least 2 folds", nameof(input));
        }

        var rows = new int[folds.FoldCount][];
        for (int f = 0; f < rows.Length; f++)
        {
            rows[f] = [.. folds.ValidationRows(f)];
            if (rows[f].Length == 0)
            {
                throw new ArgumentException($"fold {f} holds no rows", nameof(input));
            }
        }

        if (rows.Sum(r => r.Length) != rowCount)
        {
            throw new ArgumentException("the fold plan assigns some rows to no fold", nameof(input));
        }

        return rows;
    }

    private static (int TrialId, double Score) BestSingle(IReadOnlyList<BlendCandidate> pool, double[] target, Metric metric)
    {
        var best = (TrialId: 0, Score: double.PositiveInfinity);
        foreach (var candidate in pool)
        {
            double score = metric.Score(target, candidate.OutOfFold);
            if (score < best.Score || (score == best.Score && candidate.TrialId < best.TrialId))
            {
                best = (candidate.TrialId, score);
            }
        }

        return best;
    }
}
