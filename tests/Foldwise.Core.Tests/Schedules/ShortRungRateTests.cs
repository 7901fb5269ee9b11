using Foldwise.Core.Schedules;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Tests.Schedules;

public sealed class ShortRungRateTests
{
    private static ParameterSet Drawn(double rate) => ParameterSet.Of([new("learning_rate", rate), new("leaves", 31)]);

    [Fact]
    public void A_rung_at_a_ninth_of_the_rounds_runs_nine_times_the_rate()
    {
        var run = new ShortRungRate(1.0).For(Drawn(0.05), budget: 20, fullBudget: 180);

        Assert.Equal(0.45, run["learning_rate"], 12);
        Assert.Equal(31, run["leaves"]);
    }

    [Fact]
    public void The_default_scales_by_the_square_root_of_the_missing_rounds()
    {
        var run = ShortRungRate.Default.For(Drawn(0.05), budget: 20, fullBudget: 180);

        Assert.Equal(0.15, run["learning_rate"], 12);
    }

    [Fact]
    public void The_top_rung_and_the_as_drawn_rule_run_the_drawn_rate()
    {
        Assert.Equal(Drawn(0.05), new ShortRungRate(1.0).For(Drawn(0.05), budget: 180, fullBudget: 180));
        Assert.Equal(Drawn(0.05), new ShortRungRate(0.0).For(Drawn(0.05), budget: 20, fullBudget: 180));
    }

    [Fact]
    public void No_short_rung_runs_faster_than_the_ceiling_unless_the_drawn_rate_already_does()
    {
        Assert.Equal(ShortRungRate.Ceiling, new ShortRungRate(1.0).For(Drawn(0.2), budget: 20, fullBudget: 180)["learning_rate"]);
        Assert.Equal(1.5, new ShortRungRate(1.0).For(Drawn(1.5), budget: 20, fullBudget: 180)["learning_rate"]);
    }

    [Fact]
    public void A_family_without_a_learning_rate_runs_as_drawn()
    {
        var drawn = ParameterSet.Of([new("trees_depth", 6)]);

        Assert.Same(drawn, new ShortRungRate(1.0).For(drawn, budget: 20, fullBudget: 180));
    }
}
