using System.Collections.Immutable;
using System.Globalization;
using Foldwise.Cli.Output;
using Foldwise.Core.Search;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>
/// The noise floor: each done trial's fold-to-fold standard deviation against its score, coloured by family, with
/// the median spread as a line. Two trials whose scores differ by less than about that, divided by √K
/// (the standard error of a K-fold mean, common practice), cannot be told apart on this data.
/// </summary>
public static class NoiseFloorChart
{
    public const string Id = "noise-floor";

    public static ChartSection Build(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var scored = search.Trials.Where(t => t.State == TrialState.Done && t.Score is not null && t.FoldScores.Length > 1).ToList();
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        foreach (var group in scored.GroupBy(t => t.Family).OrderBy(g => families.IndexOf(g.Key)))
        {
            var dots = plot.Add.ScatterPoints(
                group.Select(t => t.Score!.Value).ToArray(),
                group.Select(t => BlendView.Spread(t.FoldScores)).ToArray(),
                FamilyColors.For(families, group.Key));
            dots.MarkerSize = 7;
            dots.LegendText = group.Key;
            series.Add(group.Key, group.Count());
        }

        string reading = "No trial has been scored on more than one fold yet.";
        if (scored.Count > 0)
        {
            var spreads = scored.Select(t => BlendView.Spread(t.FoldScores)).Order().ToList();
            double median = spreads[spreads.Count / 2];
            int k = scored[0].FoldScores.Length;
            var line = plot.Add.HorizontalLine(median);
            line.LinePattern = LinePattern.Dashed;
            line.Color = Colors.Black;
            line.LegendText = "median fold spread";
            reading = string.Create(CultureInfo.InvariantCulture,
                $"The median fold-to-fold spread is {median:F4} {search.Metric.Name}; with {k} folds two scores closer than about {median / Math.Sqrt(k):F4} (spread ÷ √{k}) are within noise, so do not rank trials or judge the blend on smaller gaps.");
        }

        plot.XLabel($"OOF {search.Metric.Name} (pooled)");
        plot.YLabel("standard deviation across folds");
        plot.ShowLegend(Alignment.UpperRight);
        return new ChartSection(Id, "Noise floor: how far apart two scores must be", reading, ChartSvg.Render(plot, Id), series.ToImmutable());
    }
}
