using System.Text.Json.Nodes;
using Foldwise.Core.Schedules;
using Spectre.Console;
using Spectre.Console.Cli;

namespace Foldwise.Cli.Commands;

/// <summary>
/// <c>foldwise plan</c>: how many candidates get how many rounds, for Hyperband's brackets and ASHA's rungs,
/// so a search can be sized before machines are spent on it.
/// </summary>
public sealed class PlanCommand(IAnsiConsole console) : Command<PlanSettings>
{
    public override int Execute(CommandContext context, PlanSettings settings, CancellationToken cancellationToken)
    {
        var plan = HyperbandPlan.For(settings.MinBudget, settings.MaxBudget, settings.Eta);
        var rungs = RungBudgets.For(settings.MinBudget, settings.MaxBudget, settings.Eta);
        var rates = rungs.Select(b => ShortRungRate.Default.Multiplier(b, settings.MaxBudget)).ToArray();
        if (settings.Json)
        {
            var brackets = new JsonArray([.. plan.Brackets.Select(b => (JsonNode?)new JsonObject
            {
                ["s"] = b.S,
                ["rounds"] = b.Rounds,
                ["rungs"] = new JsonArray([.. b.Rungs.Select(r => (JsonNode?)new JsonObject { ["candidates"] = r.Count, ["budget"] = r.Budget })]),
            })]);
            var root = new JsonObject
            {
                ["min_budget"] = settings.MinBudget,
                ["max_budget"] = settings.MaxBudget,
                ["eta"] = settings.Eta,
                ["asha_rungs"] = new JsonArray([.. rungs.Select(r => (JsonNode?)r)]),
                ["rate_multipliers"] = new JsonArray([.. rates.Select(r => (JsonNode?)Math.Round(r, 4))]),
                ["hyperband"] = brackets,
            };
            console.Profile.Out.Writer.WriteLine(root.ToJsonString(new System.Text.Json.JsonSerializerOptions { WriteIndented = true }));
            return ExitCodes.Ok;
        }

        console.MarkupLine($"ASHA rungs (rounds): {string.Join(" → ", rungs)}; a candidate moves up when it is in the top 1/{settings.Eta} of its rung.");
        console.MarkupLine($"Learning rate on each rung, × the drawn one (default schedule.rate_scaling 0.5; at most 1): {string.Join(" → ", rates.Select(r => r.ToString("0.##")))}.");
        int widest = plan.Brackets.Max(b => b.Rungs.Length);
        var table = new Table()
            .Title($"Hyperband brackets, {settings.MinBudget} to {settings.MaxBudget} rounds, η = {settings.Eta}")
            .Caption("each cell: candidates × rounds");
        table.AddColumn("bracket s");
        for (int i = 0; i < widest; i++)
        {
            table.AddColumn($"rung {i}");
        }

        table.AddColumn("total rounds");
        foreach (var bracket in plan.Brackets)
        {
            var cells = new List<string> { bracket.S.ToString() };
            cells.AddRange(bracket.Rungs.Select(r => $"{r.Count} × {r.Budget}"));
            cells.AddRange(Enumerable.Repeat("", widest - bracket.Rungs.Length));
            cells.Add(bracket.Rounds.ToString("N0"));
            table.AddRow([.. cells]);
        }

        console.Write(table);
        return ExitCodes.Ok;
    }
}
