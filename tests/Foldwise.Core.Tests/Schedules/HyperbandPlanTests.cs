using Foldwise.Core.Schedules;

namespace Foldwise.Core.Tests.Schedules;

public sealed class HyperbandPlanTests
{
    [Fact]
    public void Matches_the_published_bracket_table_for_R_81_and_eta_3()
    {
        // When the plan for budgets 1..81 with η = 3 is built
        var plan = HyperbandPlan.For(1, 81, 3);

        // Then it equals the table exactly, as (n_i, r_i) pairs per bracket
        // Hyperband bracket table, R=81, eta=3 — Li et al., JMLR 18(185), 2018, Table 1
        (int S, (int N, int R)[] Rungs)[] expected =
        [
            (4, [(81, 1), (27, 3), (9, 9), (3, 27), (1, 81)]),
            (3, [(34, 3), (11, 9), (3, 27), (1, 81)]),
            (2, [(15, 9), (5, 27), (1, 81)]),
            (1, [(8, 27), (2, 81)]),
            (0, [(5, 81)]),
        ];
        var actual = plan.Brackets.Select(b => (b.S, b.Rungs.Select(r => (r.Count, r.Budget)).ToArray())).ToArray();
        Assert.Equal(expected.Length, actual.Length);
        for (int i = 0; i < expected.Length; i++)
        {
            Assert.Equal(expected[i].S, actual[i].S);
            Assert.Equal(expected[i].Rungs, actual[i].Item2);
        }

        Assert.Equal(4, plan.SMax);
    }

    [Fact]
    public void Scales_the_default_budgets_in_units_of_the_minimum_budget()
    {
        // Given the default 25 to 400 rounds: R = 16, s_max = ⌊log_3 16⌋ = 2
        var plan = HyperbandPlan.For(25, 400, 3);

        // Then bracket s starts ⌈3/(s+1)·3^s⌉ trials at 400·3^(−s) rounds, rounded to whole rounds
        Assert.Equal(
            ["s=2: 9x44 3x133 1x400", "s=1: 5x133 1x400", "s=0: 3x400"],
            plan.Brackets.Select(b => $"s={b.S}: " + string.Join(' ', b.Rungs.Select(r => $"{r.Count}x{r.Budget}"))));
        Assert.Equal((9 * 44) + (3 * 133) + 400, plan.Brackets[0].Rounds);
    }

    [Fact]
    public void Has_one_full_budget_bracket_when_the_budgets_are_equal()
    {
        var plan = HyperbandPlan.For(50, 50, 3);

        var bracket = Assert.Single(plan.Brackets);
        Assert.Equal(new HyperbandRung(50, 1), Assert.Single(bracket.Rungs));
    }

    [Fact]
    public void Rejects_an_eta_below_two_and_a_maximum_below_the_minimum()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => HyperbandPlan.For(1, 81, 1));
        Assert.Throws<ArgumentOutOfRangeException>(() => HyperbandPlan.For(100, 81, 3));
        Assert.Throws<ArgumentOutOfRangeException>(() => HyperbandPlan.For(0, 81, 3));
    }
}
