using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>
/// Asynchronous Hyperband (Li et al., MLSys 2020, §3: ASHA run in brackets of different minimum early-stopping
/// rate s): bracket b starts its new candidates at rung b instead of rung 0, so the later brackets stop fewer
/// candidates early. That hedges against a short rung that ranks candidates badly, as Hyperband's brackets do,
/// without Hyperband's waiting. As in Hyperband, each bracket gets an equal share of the compute: a new candidate
/// goes to the bracket furthest behind its share, weighted by 1 / (the rounds a candidate started there costs on
/// average, Σ_{k≥b} budget_k · η^−(k−b), every rung keeping its top 1/η).
/// </summary>
public sealed class AshaBrackets
{
    private readonly double[] _costs;

    private AshaBrackets(double[] costs) => _costs = costs;

    /// <summary>The first <paramref name="count"/> brackets over the given rungs; 1 is plain ASHA.</summary>
    public static AshaBrackets For(ImmutableArray<int> budgets, int eta, int count)
    {
        if (count < 1 || count > budgets.Length)
        {
            throw new ArgumentOutOfRangeException(nameof(count), count, $"brackets must lie between 1 and the number of rungs, {budgets.Length}");
        }

        var costs = new double[count];
        for (int b = 0; b < count; b++)
        {
            double surviving = 1;
            for (int k = b; k < budgets.Length; k++, surviving /= eta)
            {
                costs[b] += budgets[k] * surviving;
            }
        }

        return new AshaBrackets(costs);
    }

    public int Count => _costs.Length;

    /// <summary>Average rounds a new candidate started in bracket <paramref name="bracket"/> costs.</summary>
    public double CostOf(int bracket) => _costs[bracket];

    /// <summary>The long-run share of new candidates bracket <paramref name="bracket"/> starts: equal compute gives it 1/cost, normalised.</summary>
    public double ShareOf(int bracket) => 1 / _costs[bracket] / _costs.Sum(c => 1 / c);

    /// <summary>
    /// The bracket the next new candidate starts in, given how many each bracket has started: the one whose
    /// started × cost is lowest (furthest behind an equal share of compute), ties to the more aggressive bracket.
    /// </summary>
    public int Next(IReadOnlyList<int> started)
    {
        int best = 0;
        for (int b = 1; b < _costs.Length; b++)
        {
            if ((started[b] + 1) * _costs[b] < (started[best] + 1) * _costs[best] - 1e-9)
            {
                best = b;
            }
        }

        return best;
    }
}
