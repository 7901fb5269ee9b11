using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>The chosen blend as a person reads it: members and weights, then the honest estimate beside the in-sample score.</summary>
public static class BlendView
{
    public static void Render(IAnsiConsole console, BlendSummary blend, Metric metric, IReadOnlyList<TrialRecord> trials)
    {
        var byId = trials.ToDictionary(t => t.Id);
        var table = new Table().Title($"Blend ({DefinitionWords.Of(blend.Mode)})").AddColumns("trial", "family", "rounds", $"OOF {metric.Name}", "weight");
        foreach (var member in blend.Members.Where(m => m.Weight > 0).OrderByDescending(m => m.Weight))
        {
            var trial = byId.GetValueOrDefault(member.TrialId);
            table.AddRow(
                member.TrialId.ToString(),
                member.Family,
                trial?.Budget.ToString() ?? "",
                trial?.Score?.ToString("F5") ?? "",
                member.Weight.ToString("F4"));
        }

        console.Write(table);
        var unused = blend.Members.Where(m => m.Weight <= 0).OrderBy(m => m.TrialId).ToList();
        if (unused.Count > 0)
        {
            // A pooled trial the solver gave no weight is left out of the table, but said: the lead sees it was considered.
            console.MarkupLine("Pooled but given no weight: " + string.Join(", ", unused.Select(m => $"trial {m.TrialId} ({Markup.Escape(m.Family)})")));
        }

        double spread = Spread(blend.NestedFoldScores);
        console.MarkupLine(
            $"Blend {metric.Name}: in-sample [bold]{blend.InSampleScore:F5}[/], nested estimate [bold]{blend.NestedScore:F5}[/] " +
            $"(fold spread ±{spread:F5}); best single trial {blend.BestSingleTrialId}: {blend.BestSingleScore:F5}");
    }

    /// <summary>Sample standard deviation; 0 for fewer than two values.</summary>
    public static double Spread(IReadOnlyList<double> values)
    {
        if (values.Count < 2)
        {
            return 0;
        }

        double mean = values.Average();
        return Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Count - 1));
    }
}
