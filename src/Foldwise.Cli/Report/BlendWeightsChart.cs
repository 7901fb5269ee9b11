using System.Collections.Immutable;
using System.Globalization;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>
/// The blend and its diversity: one horizontal bar per pool member, heaviest on top, coloured by family; the reading
/// gives how many members and families carry weight and the effective number of members, 1 / Σw² (equal to the
/// member count when weights are equal, 1 when one member carries everything).
/// </summary>
public static class BlendWeightsChart
{
    public const string Id = "blend-weights";

    public static ChartSection Build(StoredSearch search)
    {
        var blend = search.Blend;
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        string reading = "No blend is stored yet: the search has not reached its blend stage.";
        if (blend is not null)
        {
            var members = blend.Members.OrderBy(m => m.Weight).ToList();
            var scores = search.Trials.ToDictionary(t => t.Id, t => t.Score);
            var bars = members.Select((m, i) => new Bar
            {
                Position = i,
                Value = m.Weight,
                FillColor = FamilyColors.For(families, m.Family),
                Label = m.Weight.ToString("F3", CultureInfo.InvariantCulture),
            }).ToList();
            var plotted = plot.Add.Bars(bars);
            plotted.Horizontal = true;
            plot.Axes.Left.SetTicks(
                [.. members.Select((_, i) => (double)i)],
                [.. members.Select(m => $"trial {m.TrialId} {m.Family} ({Score(scores, m.TrialId)})")]);
            plot.Axes.Margins(left: 0);
            plot.XLabel("weight (non-negative, summing to one)");
            foreach (var group in members.GroupBy(m => m.Family))
            {
                series.Add(group.Key, group.Count());
            }

            string m = search.Metric.Name;
            var weighted = blend.Members.Where(x => x.Weight > 0).ToList();
            double effective = 1 / weighted.Sum(x => x.Weight * x.Weight);
            reading = string.Create(CultureInfo.InvariantCulture,
                $"{weighted.Count} of {blend.Members.Length} pool members from {weighted.Select(x => x.Family).Distinct().Count()} of {families.Count} families carry weight, worth {effective:F1} equally weighted members; a member with weight 0 adds nothing the others lack. The blend's nested estimate is {blend.NestedScore:F5} {m} (in-sample {blend.InSampleScore:F5}, which flatters itself) against {blend.BestSingleScore:F5} for the best single trial {blend.BestSingleTrialId}: the blend is worth keeping only if that gap is larger than the noise floor above. {KeptText(search)}");
        }

        return new ChartSection(Id, "The blend: its members and how diverse they are", reading, ChartSvg.Render(plot, Id), series.ToImmutable());
    }

    /// <summary>Which models will score new rows, with their files' SHA-256, so a lead can audit them.</summary>
    internal static string KeptText(StoredSearch search) => search.Kept is { } kept
        ? string.Create(CultureInfo.InvariantCulture, $"Kept for 'foldwise predict' ({kept.Bytes / 1e6:F1} MB in {Tuning.KeptModelFiles.FolderName}/): ") +
          string.Join("; ", kept.Members.Select(k => string.Create(CultureInfo.InvariantCulture, $"trial {k.TrialId} {k.Family} weight {k.Weight:F3}, {k.Folds} fold models, SHA-256 {k.Hash}"))) + "."
        : "No models are kept, so new rows cannot be scored yet: 'foldwise blend STORE' re-fits and keeps the blend's members.";

    private static string Score(Dictionary<int, double?> scores, int id) =>
        scores.GetValueOrDefault(id) is { } s ? s.ToString("F4", CultureInfo.InvariantCulture) : "?";
}
