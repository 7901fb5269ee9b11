using System.Text.Json.Nodes;
using Foldwise.Core.Definition;
using Foldwise.Core.Schedules;
using Foldwise.Core.Spaces;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise plan</c>: how many candidates get how much budget, in the family's own unit, for Hyperband's brackets and ASHA's rungs,
/// so a search can be sized before machines are spent on it.
/// </summary>
public sealed class PlanCommand(IAnsiConsole console) : Command<PlanSettings>
{
    public override int Execute(CommandContext context, PlanSettings settings, CancellationToken cancellationToken)
    {
        string unit = settings.Descriptor.Unit.Many;
        var plan = HyperbandPlan.For(settings.FirstRung, settings.FullBudget, settings.Eta);
        var rungs = RungBudgets.For(settings.FirstRung, settings.FullBudget, settings.Eta);
        var rates = rungs.Select(b => ShortRungRate.Default.Multiplier(b, settings.FullBudget)).ToArray();

        // With every bracket asked for (schedule.brackets = rungs): where each starts, what a candidate costs there on
        // average, and the share of new candidates that equal compute per bracket gives it.
        var hedge = AshaBrackets.For(rungs, settings.Eta, rungs.Length);
        var starts = Enumerable.Range(0, hedge.Count).Select(b => (Bracket: b + 1, Budget: rungs[b], Rounds: hedge.CostOf(b), Share: hedge.ShareOf(b))).ToArray();
        var screen = settings.ScreenFolds is { } n ? RungBudgets.For(n, settings.Folds, settings.Eta) : default;
        if (settings.Json)
        {
            var brackets = new JsonArray([.. plan.Brackets.Select((b, i) => (JsonNode?)new JsonObject
            {
                ["bracket"] = i + 1,
                ["halvings"] = b.S,
                ["rounds"] = b.Rounds,
                ["rungs"] = new JsonArray([.. b.Rungs.Select(r => (JsonNode?)new JsonObject { ["candidates"] = r.Count, ["budget"] = r.Budget })]),
            })]);
            var root = new JsonObject
            {
                ["family"] = settings.Family,
                ["unit"] = unit,
                ["first_rung"] = settings.FirstRung,
                ["full_budget"] = settings.FullBudget,
                ["eta"] = settings.Eta,
                ["asha_rungs"] = new JsonArray([.. rungs.Select(r => (JsonNode?)r)]),
                ["rate_multipliers"] = new JsonArray([.. rates.Select(r => (JsonNode?)Math.Round(r, 4))]),
                ["asha_brackets"] = new JsonArray([.. starts.Select(b => (JsonNode?)new JsonObject
                {
                    ["bracket"] = b.Bracket,
                    ["start_budget"] = b.Budget,
                    ["mean_rounds"] = Math.Round(b.Rounds, 2),
                    ["share_of_new_candidates"] = Math.Round(b.Share, 4),
                })]),
                ["hyperband"] = brackets,
            };
            if (!screen.IsDefault)
            {
                root["fold_screen_rungs"] = new JsonArray([.. screen.Select(r => (JsonNode?)r)]);
            }

            console.Profile.Out.Writer.WriteLine(root.ToJsonString(new System.Text.Json.JsonSerializerOptions { WriteIndented = true }));
            return ExitCodes.Ok;
        }

        console.MarkupLine($"{settings.Family}, budgets in {unit}.");
        if (screen.IsDefault)
        {
            console.MarkupLine($"A definition that names no rungs races over folds (schedule.screen_folds {ScheduleDefaults.ScreenFolds}, η {ScheduleDefaults.FoldScreenEta}; see --screen-folds); " +
                "with schedule.first_rung, or screen_folds 0, it screens on the rungs below.");
        }

        console.MarkupLine($"ASHA rungs ({unit}): {string.Join(" → ", rungs)}; a candidate moves up when it is in the top 1/{settings.Eta} of its rung.");
        console.MarkupLine($"Learning rate on each rung, × the drawn one (default schedule.rate_scaling 0.5; at most 1): {string.Join(" → ", rates.Select(r => r.ToString("0.##")))}.");
        console.MarkupLine($"ASHA brackets (schedule.brackets k runs the first k, each with an equal share of compute): " +
            string.Join("; ", starts.Select(b => $"bracket {b.Bracket} starts at {b.Budget} {unit}, {b.Rounds:0.#} per candidate on average")) +
            $"; with all {starts.Length}, new candidates split {string.Join(" : ", starts.Select(b => b.Share.ToString("P0")))}.");
        if (!screen.IsDefault)
        {
            console.MarkupLine($"Fold screen (schedule.screen_folds {settings.ScreenFolds}): rungs in folds {string.Join(" → ", screen)} of {settings.Folds}; every trial trains {settings.FullBudget} {unit} at the drawn learning rate, " +
                $"a candidate on n folds costing n/{settings.Folds} of a whole trial, and moves up when it is in the top 1/{settings.Eta} of its rung (all scored on the same folds).");
        }

        int widest = plan.Brackets.Max(b => b.Rungs.Length);
        var table = new Table()
            .Title($"Hyperband brackets, {settings.FirstRung} to {settings.FullBudget} {unit}, η = {settings.Eta}")
            .Caption($"each cell: candidates × {unit}");
        table.AddColumn("bracket");
        table.AddColumn("halvings");
        for (int i = 0; i < widest; i++)
        {
            table.AddColumn($"rung {i}");
        }

        table.AddColumn($"total {unit}");
        foreach (var (bracket, i) in plan.Brackets.Select((b, i) => (b, i)))
        {
            var cells = new List<string> { (i + 1).ToString(), bracket.S.ToString() };
            cells.AddRange(bracket.Rungs.Select(r => $"{r.Count} × {r.Budget}"));
            cells.AddRange(Enumerable.Repeat("", widest - bracket.Rungs.Length));
            cells.Add(bracket.Rounds.ToString("N0"));
            table.AddRow([.. cells]);
        }

        console.Write(table);
        console.MarkupLine("Each family's own ASHA rungs when a definition gives none (families.NAME.first_rung / full_budget):");
        foreach (var d in FamilyDescriptors.All)
        {
            console.MarkupLine($"  {d.Name}: {string.Join(" → ", RungBudgets.For(d.FirstRung, d.FullBudget, settings.Eta))} {d.Unit.Many}{(d.InDefaultSet ? "" : " (not in the default set)")}");
        }

        return ExitCodes.Ok;
    }
}
