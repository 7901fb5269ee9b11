using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>
/// The brackets of Hyperband (Li et al., JMLR 18(185), 2018, Algorithm 1) in the order they run, s = s_max … 0.
/// With R = MaxBudget/MinBudget and s_max = ⌊log_η R⌋, bracket s starts n = ⌈(s_max+1)/(s+1)·η^s⌉ trials at
/// MaxBudget·η^(−s) rounds, and rung i keeps ⌊n·η^(−i)⌋ of them at MaxBudget·η^(i−s) rounds (rounded to whole rounds).
/// </summary>
public sealed record HyperbandPlan(int MinBudget, int MaxBudget, int Eta, ImmutableArray<HyperbandBracket> Brackets)
{
    public int SMax => Brackets[0].S;

    /// <summary>Plans are equal when their settings and brackets are.</summary>
    public bool Equals(HyperbandPlan? other) =>
        other is not null && (MinBudget, MaxBudget, Eta) == (other.MinBudget, other.MaxBudget, other.Eta) && Brackets.SequenceEqual(other.Brackets);

    public override int GetHashCode() => HashCode.Combine(MinBudget, MaxBudget, Eta);

    public static HyperbandPlan For(int minBudget, int maxBudget, int eta)
    {
        ScheduleChecks.Validate(minBudget, maxBudget, eta);

        // s_max = ⌊log_η R⌋ in whole numbers: the largest s with MinBudget·η^s ≤ MaxBudget (no floating log).
        int sMax = 0;
        while ((long)minBudget * Power(eta, sMax + 1) <= maxBudget)
        {
            sMax++;
        }

        var brackets = ImmutableArray.CreateBuilder<HyperbandBracket>(sMax + 1);
        for (int s = sMax; s >= 0; s--)
        {
            long etaS = Power(eta, s);
            long n = (((sMax + 1) * etaS) + s) / (s + 1);
            var rungs = ImmutableArray.CreateBuilder<HyperbandRung>(s + 1);
            for (int i = 0; i <= s; i++)
            {
                long count = n / Power(eta, i);
                int budget = (int)Math.Round(maxBudget / (double)Power(eta, s - i), MidpointRounding.AwayFromZero);
                rungs.Add(new HyperbandRung(Math.Max(budget, 1), (int)count));
            }

            brackets.Add(new HyperbandBracket(s, rungs.MoveToImmutable()));
        }

        return new HyperbandPlan(minBudget, maxBudget, eta, brackets.MoveToImmutable());
    }

    private static long Power(int eta, int exponent)
    {
        long p = 1;
        for (int i = 0; i < exponent; i++)
        {
            p *= eta;
        }

        return p;
    }
}
