namespace Foldwise.Core.Definition;

/// <summary>Reads <c>schedule</c>; what it leaves out keeps <see cref="ScheduleOptions"/>' defaults.</summary>
internal static class ScheduleReader
{
    public static ScheduleOptions Read(DefinitionCheck check, DefinitionNode node)
    {
        var schedule = check.Object(node, DefinitionNames.ScheduleKeys);
        var standard = new ScheduleOptions();
        var min = schedule.Get("min_rounds")?.Value;
        var max = schedule.Get("max_rounds")?.Value;
        var options = new ScheduleOptions(
            schedule.Get("kind") is { } k ? check.Word(k.Value, DefinitionNames.Schedules) : standard.Kind,
            schedule.Get("proposer") is { } p ? check.Word(p.Value, DefinitionNames.Proposers) : standard.Proposer,
            min is null ? standard.MinBudget : check.Whole(min, 1),
            max is null ? standard.MaxBudget : check.Whole(max, 1),
            schedule.Get("eta") is { } e ? check.Whole(e.Value, 2, " (each rung keeps 1/eta)") : standard.Eta,
            schedule.Get("rate_scaling") is { } r ? Scaling(check, r.Value) : standard.RateScaling,
            schedule.Get("brackets") is { } b ? check.Whole(b.Value, 1) : standard.Brackets);

        if (options.MaxBudget < options.MinBudget)
        {
            // Point at whichever of the two the file wrote; if it wrote one, the other is the default.
            string problem = $"'schedule.max_rounds' ({options.MaxBudget}{(max is null ? ", the default" : "")}) " +
                             $"is below 'schedule.min_rounds' ({options.MinBudget}{(min is null ? ", the default" : "")})";
            throw check.Fail(max ?? min!, problem);
        }

        if (schedule.Get("brackets") is { } given)
        {
            var rungs = Schedules.RungBudgets.For(options.MinBudget, options.MaxBudget, options.Eta);
            if (options.Kind != ScheduleKind.Asha && options.Brackets != 1)
            {
                throw check.Fail(given.Value, $"'schedule.brackets' applies to the asha schedule only, not '{DefinitionNames.Schedules.NameOf(options.Kind)}'");
            }

            if (options.Brackets > rungs.Length)
            {
                throw check.Fail(given.Value, $"'schedule.brackets' ({options.Brackets}) is more than the schedule's {rungs.Length} rungs ({string.Join(", ", rungs)} rounds)");
            }
        }

        return options;
    }

    private static double Scaling(DefinitionCheck check, DefinitionNode node)
    {
        double value = check.Number(node);
        return value is >= 0 and <= 1
            ? value
            : throw check.Fail(node, $"'{node.Path}' must be between 0 (short rungs run the drawn learning rate) and 1 (scaled by max_rounds / rounds), got {node.Describe()}");
    }
}
