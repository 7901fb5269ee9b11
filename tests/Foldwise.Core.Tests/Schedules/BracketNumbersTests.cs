using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;

namespace Foldwise.Core.Tests.Schedules;

public sealed class BracketNumbersTests
{
    [Fact]
    public void Asha_trials_keep_their_stored_number_and_a_single_bracket_shows_none()
    {
        // Given an ASHA schedule with three brackets
        var numbers = BracketNumbers.For(new ScheduleOptions(ScheduleKind.Asha, FirstRung: 20, FullBudget: 180, Eta: 3, Brackets: 3));

        // Then stored numbers read as plan numbers them (from 1), and 0 (no brackets) reads as none
        Assert.Equal([null, 1, 2, 3], Enumerable.Range(0, 4).Select(numbers.Of));
    }

    [Fact]
    public void Hyperband_runs_past_the_plans_last_bracket_fold_back_onto_the_plans_brackets()
    {
        // Given Hyperband over 1 to 9 rounds with η 3: plan lists three brackets (s_max = 2)
        var numbers = BracketNumbers.For(new ScheduleOptions(ScheduleKind.Hyperband, FirstRung: 1, FullBudget: 9, Eta: 3));

        // Then the runs 1..7 the schedule stores are plan's brackets 1, 2, 3, 1, 2, 3, 1
        Assert.Equal([1, 2, 3, 1, 2, 3, 1], Enumerable.Range(1, 7).Select(o => numbers.Of(o)!.Value));
    }
}
