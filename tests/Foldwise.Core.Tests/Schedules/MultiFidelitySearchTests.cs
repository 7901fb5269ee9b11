using Foldwise.Core.Definition;
using Foldwise.Core.Proposers;
using Foldwise.Core.Tests.Proposers;

namespace Foldwise.Core.Tests.Schedules;

/// <summary>
/// Whole searches on published multi-fidelity test functions (Kandasamy et al., ICML 2017, as written in
/// <see cref="TestFunctions"/>), scored the way the search bench scores the demo table: the share of random search's
/// compute (16 trials at the full budget) that a search needs to reach random search's best, per seed; 41 seeds.
/// Budgets 1 to 9 at η 9: the bench's 20 → 180 shape at a ninth of the scale.
/// </summary>
public sealed class MultiFidelitySearchTests
{
    private const int Seeds = 41, RandomTrials = 16, Max = 9;

    private static double Median(double[] sorted) => sorted[sorted.Length / 2];

    // Two checks ask for ASHA+TPE's shares on each function; the runs are deterministic, so the second reuses the first's.
    private static readonly System.Collections.Concurrent.ConcurrentDictionary<(ScheduleKind, ProposerKind, bool, int, int, TpeOptions?, int), Lazy<double[]>> Computed = new();

    private static double[] Shares(ScheduleKind kind, ProposerKind proposer, bool hartmann, int randomTrials = RandomTrials, int eta = 9, TpeOptions? tpe = null, int brackets = 1) =>
        Computed.GetOrAdd((kind, proposer, hartmann, randomTrials, eta, tpe, brackets), _ => new Lazy<double[]>(() => Compute(kind, proposer, hartmann, randomTrials, eta, tpe, brackets))).Value;

    private static double[] Compute(ScheduleKind kind, ProposerKind proposer, bool hartmann, int randomTrials, int eta, TpeOptions? tpe, int brackets) =>
        MultiFidelityRuns.ComputeShares(
            new ScheduleOptions(kind, proposer, FirstRung: 1, FullBudget: Max, Eta: eta, Brackets: brackets),
            hartmann ? TestFunctions.HartmannSpace : TestFunctions.BraninSpace,
            hartmann ? (p, r) => TestFunctions.HartmannAt(p, r, Max) : (p, r) => TestFunctions.BraninAt(p, r, Max),
            randomTrials, Seeds, tpe);

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Asha_with_tpe_matches_random_search_on_a_quarter_of_its_compute(bool hartmann)
    {
        // When ASHA with TPE and plain TPE at the full budget each search until they reach random search's best
        var asha = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann);
        var full = Shares(ScheduleKind.Full, ProposerKind.Tpe, hartmann);

        // Then ASHA's median share is within the aim set for this check, 25 % (measured 25.0 % on Branin, on the line, and 13.2 % on
        // Hartmann-6) and under half of full-budget TPE's (measured 87.5 % and 62.5 %): the short rung, not the proposer alone,
        // saves the compute
        Assert.True(Median(asha) <= 0.25, $"ASHA+TPE median share {Median(asha):P1}");
        Assert.True(Median(asha) <= 0.5 * Median(full), $"ASHA+TPE {Median(asha):P1} against full-budget TPE {Median(full):P1}");
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Asha_with_random_candidates_matches_random_search_on_a_quarter_of_its_compute_but_misses_more_often_than_with_tpe(bool hartmann)
    {
        // When ASHA screens random candidates instead (the control the search bench can also run)
        var random = Shares(ScheduleKind.Asha, ProposerKind.Random, hartmann);
        var tpe = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann);

        // Then its median is within a quarter too (measured 19.4 % on Branin, 15.3 % on Hartmann-6), but it misses random
        // search's best within its compute on more seeds than with TPE (measured 9 against 3 of 41 on Branin, 7 against 2)
        Assert.True(Median(random) <= 0.25, $"ASHA+random median share {Median(random):P1}");
        Assert.True(random.Count(double.IsInfinity) > tpe.Count(double.IsInfinity), $"missed with random candidates {random.Count(double.IsInfinity)}, with TPE {tpe.Count(double.IsInfinity)}");
    }

    [Theory]
    [InlineData(false, 9)]
    [InlineData(false, 3)]
    [InlineData(true, 9)]
    [InlineData(true, 3)]
    public void Tpe_on_the_ladder_misses_a_longer_random_search_far_less_often_than_fitted_on_the_top_budget(bool hartmann, int eta)
    {
        // When TPE inside ASHA is fitted on the ladder, or on the highest budget with enough results (BOHB's rule), and the
        // target is random search's best of 48 full-budget trials
        var ladder = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann, randomTrials: 48, eta: eta, new TpeOptions(Ladder: true));
        var top = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann, randomTrials: 48, eta: eta, new TpeOptions(Ladder: false));

        // Then the ladder misses the target within random search's compute on at most half as many seeds (measured, of 41:
        // Branin 0 against 11 at η 9, 1 against 15 at η 3; Hartmann-6 0 against 3, 1 against 14)
        int missedLadder = ladder.Count(double.IsInfinity), missedTop = top.Count(double.IsInfinity);
        Assert.True(2 * missedLadder <= missedTop, $"missed on the ladder {missedLadder}, on the top budget {missedTop}");
    }

    [Theory]
    [InlineData(false)]
    [InlineData(true)]
    public void Two_brackets_cost_compute_where_the_short_budget_ranks_well_yet_stay_well_under_full_budget_tpe(bool hartmann)
    {
        // When ASHA+TPE runs in two brackets (asynchronous Hyperband: half the compute goes to candidates started at the
        // full budget), on functions whose short budget is only mildly biased
        var plain = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann);
        var hedged = Shares(ScheduleKind.Asha, ProposerKind.Tpe, hartmann, brackets: 2);
        var full = Shares(ScheduleKind.Full, ProposerKind.Tpe, hartmann);

        // Then the hedge costs (measured medians 36.1 % against plain ASHA's 25.0 % on Branin, 26.4 % against 13.2 % on
        // Hartmann-6; misses 6 against 3 and 4 against 2 of 41), the price the demo table's misleading short rung repays
        // (bench: 38.9 % against 77.8 %), and it still needs at most half of full-budget TPE's compute (87.5 %, 62.5 %)
        Assert.True(Median(hedged) >= Median(plain), $"two brackets {Median(hedged):P1}, plain ASHA {Median(plain):P1}");
        Assert.True(Median(hedged) <= 0.5 * Median(full), $"two brackets {Median(hedged):P1} against full-budget TPE {Median(full):P1}");
    }
}
