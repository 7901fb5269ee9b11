using System.Collections.Immutable;
using Foldwise.Core.Search;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>Best out-of-fold score so far per family against minutes since the search began (each finished trial is a step).</summary>
public static class BestOverTimeChart
{
    public const string Id = "best-over-time";

    public static ChartSection Build(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var origin = ReportClock.Origin(search);
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        foreach (string family in families)
        {
            var done = search.Trials
                .Where(t => t.Family == family && t.State == TrialState.Done && t.Score is not null && t.Finished is not null)
                .OrderBy(t => t.Finished)
                .ToList();
            if (done.Count == 0)
            {
                continue;
            }

            var xs = new List<double>();
            var ys = new List<double>();
            double best = double.MaxValue;
            foreach (var t in done)
            {
                best = Math.Min(best, t.Score!.Value);
                xs.Add(ReportClock.Minutes(origin, t.Finished!.Value));
                ys.Add(best);
            }

            var line = plot.Add.Scatter(xs.ToArray(), ys.ToArray(), FamilyColors.For(families, family));
            line.ConnectStyle = ConnectStyle.StepHorizontal;
            line.LineWidth = 2;
            line.MarkerSize = 6;
            line.LegendText = family;
            series.Add(family, xs.Count);
        }

        plot.XLabel("minutes since the search began");
        plot.YLabel($"best OOF {search.Metric.Name} so far");
        plot.ShowLegend(Alignment.UpperRight);
        return new ChartSection(
            Id,
            "Best score over time, per family",
            "Where a family's line goes flat the search stopped finding better candidates for it: more hours would buy little; a line still falling says the budget ended too soon.",
            ChartSvg.Render(plot, Id),
            series.ToImmutable());
    }
}
