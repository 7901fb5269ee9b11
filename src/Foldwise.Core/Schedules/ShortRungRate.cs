using Foldwise.Core.Spaces;

namespace Foldwise.Core.Schedules;

/// <summary>
/// The learning rate a trial below the top rung runs at. A candidate's drawn learning rate is the one it
/// would use at the full budget; run as drawn for a fraction of the rounds, a slow learner is stopped
/// long before it has fitted, so a short rung ranks fast learners first even where they lose at the
/// full budget. Scaling the rate by (full budget / budget)^<see cref="Exponent"/> moves the product of
/// rate and rounds towards the full-budget one (rounds and learning rate trade off roughly inversely:
/// common practice), so a short rung screens the candidate it will promote. Full proportion (exponent 1)
/// overshoots: a ninth of the rounds at nine times the rate fits coarser trees than the full run.
/// Measured on the full-size demo table, 16 random candidates per seed scored at 20 and at 180 rounds
/// (bench/Foldwise.Bench.Search --part probe), Spearman correlation of the two orders:
/// exponent 0: 0.62, 0.35 (seeds 1, 4); 0.35: 0.32, 0.83, 0.55 (seeds 2, 3, 5); 0.5: 0.73, 0.55, 0.95, 0.91, 0.89
/// (seeds 1–5); 0.65: 0.82, 0.80 (seeds 2, 3); 1: −0.30, 0.01 (seeds 1, 4). Hence the square root, <see cref="Default"/>.
/// </summary>
/// <param name="Exponent">1 scales the rate in proportion to the missing rounds; 0 runs it as drawn.</param>
public sealed record ShortRungRate(double Exponent)
{
    /// <summary>The parameter scaled; families without it run every rung as drawn.</summary>
    public const string Parameter = "learning_rate";

    /// <summary>A step beyond the whole residual overshoots under squared loss (from memory), so no rung runs faster than this.</summary>
    public const double Ceiling = 1.0;

    /// <summary>The square root of the missing rounds' ratio: the default.</summary>
    public static ShortRungRate Default { get; } = new(0.5);

    /// <summary>The factor on the drawn rate before the ceiling: (full budget / budget)^Exponent, 1 at the full budget.</summary>
    public double Multiplier(int budget, int fullBudget)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(budget);
        return budget >= fullBudget ? 1.0 : Math.Pow((double)fullBudget / budget, Exponent);
    }

    /// <summary>The parameters a trial of <paramref name="budget"/> rounds runs, for a search whose full budget is <paramref name="fullBudget"/>.</summary>
    public ParameterSet For(ParameterSet drawn, int budget, int fullBudget)
    {
        double multiplier = Multiplier(budget, fullBudget);
        if (multiplier == 1 || !drawn.Values.TryGetValue(Parameter, out double rate))
        {
            return drawn;
        }

        return new ParameterSet(drawn.Values.SetItem(Parameter, Math.Max(rate, Math.Min(rate * multiplier, Ceiling))));
    }
}
