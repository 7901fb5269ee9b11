using System.Collections.Immutable;

namespace Foldwise.Core.Schedules;

/// <summary>
/// The brackets of Hyperband (Li et al., JMLR 18(185), 2018, Algorithm 1) in the order they run, s = s_max … 0.
/// With R = FullBudget/FirstRung and s_max = ⌊log_η R⌋, bracket s starts n = ⌈(s_max+1)/(s+1)·η^s⌉ trials at
/// FullBudget·η^(−s) rounds, and rung i keeps ⌊n·η^(−i)⌋ of them at FullBudget·η^(i−s) rounds (rounded to whole rounds).
/// </summary>
public sealed record HyperbandPlan(int FirstRung, int FullBudget, int Eta, ImmutableArray<HyperbandBracket> Brackets)
{
    public int SMax => Brackets[0].S;

    /// <summary>Plans are equal when their settings and brackets are.</summary>
    public bool Equals(HyperbandPlan? other) =>
        other is not null && (FirstRung, FullBudget, Eta) == (other.FirstRung, other.FullBudget, other.Eta) && Brackets.SequenceEqual(other.Brackets);

    public override int GetHashCode() => HashCode.Combine(FirstRung, FullBudget, Eta);

    public static HyperbandPlan For(int firstRung, int fullBudget, int eta)
    {
        ScheduleChecks.Validate(firstRung, fullBudget, eta);

        // s_max = ⌊log_η R⌋ in whole numbers: the largest s with FirstRung·η^s ≤ FullBudget (no floating log).
        int sMax = 0;
        while ((long)firstRung * Power(eta, sMax + 1) <= fullBudget)
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
                int budget = (int)Math.Round(fullBudget / (double)Power(eta, s - i), MidpointRounding.AwayFromZero);
                rungs.Add(new HyperbandRung(Math.Max(budget, 1), (int)count));
            }

            brackets.Add(new HyperbandBracket(s, rungs.MoveToImmutable()));
        }

        return new HyperbandPlan(firstRung, fullBudget, eta, brackets.MoveToImmutable());
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
