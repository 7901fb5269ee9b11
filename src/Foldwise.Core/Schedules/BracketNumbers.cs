using Foldwise.Core.Definition;

namespace Foldwise.Core.Schedules;

/// <summary>
/// The one numbering of brackets a person reads — in plan, show, history, the report and JSON: from 1, in the
/// order <c>foldwise plan</c> lists them. ASHA trials store that number already (0 when the schedule has a single
/// bracket); Hyperband trials store the ordinal of their bracket's run, which counts on past the plan's last
/// bracket when the plan starts over, so it is folded back onto the plan's brackets here.
/// </summary>
public sealed class BracketNumbers
{
    private readonly int _hyperbandBrackets;
    private readonly Dictionary<string, int> _byFamily = new(StringComparer.Ordinal);

    private BracketNumbers(int hyperbandBrackets) => _hyperbandBrackets = hyperbandBrackets;

    /// <summary>A search's numbering: under Hyperband each family cycles through the brackets of its own rungs.</summary>
    public static BracketNumbers For(SearchDefinition definition)
    {
        ArgumentNullException.ThrowIfNull(definition);
        var numbers = For(definition.Schedule);
        if (definition.Schedule.Kind == ScheduleKind.Hyperband)
        {
            foreach (var family in definition.Families)
            {
                var budget = family.BudgetUnder(definition.Schedule);
                numbers._byFamily[family.Family] = HyperbandPlan.For(budget.FirstRung, budget.FullBudget, definition.Schedule.Eta).Brackets.Length;
            }
        }

        return numbers;
    }

    /// <summary>The bracket number of a trial of <paramref name="family"/> stored with bracket <paramref name="stored"/>.</summary>
    public int? Of(string family, int stored)
    {
        int count = _byFamily.GetValueOrDefault(family, _hyperbandBrackets);
        return stored < 1 ? null : count > 0 ? ((stored - 1) % count) + 1 : stored;
    }

    public static BracketNumbers For(ScheduleOptions schedule) => new(schedule.Kind == ScheduleKind.Hyperband
        ? HyperbandPlan.For(schedule.FirstRung, schedule.FullBudget, schedule.Eta).Brackets.Length
        : 0);

    /// <summary>The bracket a trial stored as <paramref name="stored"/> belongs to, or null when its schedule has no brackets.</summary>
    public int? Of(int stored) => stored < 1 ? null
        : _hyperbandBrackets > 0 ? ((stored - 1) % _hyperbandBrackets) + 1
        : stored;
}
