using Foldwise.Core.Blending;
using Foldwise.Core.Definition;
using Foldwise.Core.Metrics;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using Spectre.Console;

namespace Foldwise.Cli.Output;

/// <summary>The chosen blend as a person reads it: members and weights, then the honest estimate beside the in-sample score.</summary>
public static class BlendView
{
    /// <param name="families">The search's families, so that one given no weight is named too.</param>
    public static void Render(IAnsiConsole console, BlendSummary blend, Metric metric, IReadOnlyList<TrialRecord> trials, IEnumerable<string>? families = null)
    {
        var byId = trials.ToDictionary(t => t.Id);
        var table = new Table().Title($"Blend ({DefinitionWords.Of(blend.Mode)})").AddColumns("trial", "family", "budget", $"OOF {metric.Name}", "weight");
        foreach (var member in blend.Members.Where(m => m.Weight > 0).OrderByDescending(m => m.Weight))
        {
            var trial = byId.GetValueOrDefault(member.TrialId);
            table.AddRow(
                member.TrialId.ToString(),
                member.Family,
                trial is null ? "" : FamilyDescriptors.UnitOf(trial.Family).Count(trial.Budget),
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

        console.MarkupLine(Markup.Escape(CarriedBy(blend, families ?? [])));
        double spread = Spread(blend.NestedFoldScores);
        console.MarkupLine(
            $"Blend {metric.Name}: in-sample [bold]{blend.InSampleScore:F5}[/], nested estimate [bold]{blend.NestedScore:F5}[/] " +
            $"(fold spread ±{spread:F5}); best single trial {blend.BestSingleTrialId}: {blend.BestSingleScore:F5}");
    }

    /// <summary>"Weight by family: lightgbm 0.712, linear 0.288; none for fasttree, forest."</summary>
    public static string CarriedBy(BlendSummary blend, IEnumerable<string> families)
    {
        var weights = FamilyWeights.Of(blend, families);
        var carrying = weights.Where(w => w.Weight > 0).Select(w => string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{w.Family} {w.Weight:F3}"));
        var none = weights.Where(w => w.Weight <= 0).Select(w => w.Family).ToList();
        return $"Weight by family: {string.Join(", ", carrying)}{(none.Count > 0 ? $"; none for {string.Join(", ", none)}" : "")}.";
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
