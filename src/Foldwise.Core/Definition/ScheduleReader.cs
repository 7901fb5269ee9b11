namespace Foldwise.Core.Definition;

/// <summary>Reads <c>schedule</c>; what it leaves out keeps <see cref="ScheduleOptions"/>' defaults, but for the screen and η (<see cref="ScheduleDefaults"/>).</summary>
internal static class ScheduleReader
{
    public static ScheduleOptions Read(DefinitionCheck check, DefinitionNode node)
    {
        var schedule = check.Object(node, DefinitionNames.ScheduleKeys);
        var standard = new ScheduleOptions();
        var first = schedule.Get("first_rung")?.Value;
        var full = schedule.Get("full_budget")?.Value;
        var kind = schedule.Get("kind") is { } k ? check.Word(k.Value, DefinitionNames.Schedules) : standard.Kind;
        int screenFolds = schedule.Get("screen_folds") is { } s
            ? check.Whole(s.Value, 0, " (the folds a new candidate first trains; 0: rungs count the learners' budget)")
            : ScheduleDefaults.ScreenFoldsFor(kind, firstRungWritten: first is not null);
        var options = new ScheduleOptions(
            kind,
            schedule.Get("proposer") is { } p ? check.Word(p.Value, DefinitionNames.Proposers) : standard.Proposer,
            first is null ? standard.FirstRung : check.Whole(first, 1),
            full is null ? standard.FullBudget : check.Whole(full, 1),
            schedule.Get("eta") is { } e ? check.Whole(e.Value, 2, " (each rung keeps 1/eta)") : ScheduleDefaults.EtaFor(screenFolds),
            schedule.Get("rate_scaling") is { } r ? Scaling(check, r.Value) : standard.RateScaling,
            schedule.Get("brackets") is { } b ? check.Whole(b.Value, 1) : standard.Brackets,
            screenFolds);

        if (schedule.Get("screen_folds") is { } screen && options.ByFolds && options.Kind != ScheduleKind.Asha)
        {
            throw check.Fail(screen.Value, $"'schedule.screen_folds' applies to the asha schedule only, not '{DefinitionNames.Schedules.NameOf(options.Kind)}'");
        }

        if (options.FullBudget < options.FirstRung)
        {
            // Point at whichever of the two the file wrote; if it wrote one, the other is the default.
            string problem = $"'schedule.full_budget' ({options.FullBudget}{(full is null ? ", the default" : "")}) " +
                             $"is below 'schedule.first_rung' ({options.FirstRung}{(first is null ? ", the default" : "")})";
            throw check.Fail(full ?? first!, problem);
        }

        if (schedule.Get("brackets") is { } given)
        {
            var rungs = Schedules.RungBudgets.For(options.FirstRung, options.FullBudget, options.Eta);
            if (options.Kind != ScheduleKind.Asha && options.Brackets != 1)
            {
                throw check.Fail(given.Value, $"'schedule.brackets' applies to the asha schedule only, not '{DefinitionNames.Schedules.NameOf(options.Kind)}'");
            }

            if (!options.ByFolds && options.Brackets > rungs.Length)
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
            : throw check.Fail(node, $"'{node.Path}' must be between 0 (short rungs run the drawn learning rate) and 1 (scaled by full_budget / rounds), got {node.Describe()}");
    }
}
