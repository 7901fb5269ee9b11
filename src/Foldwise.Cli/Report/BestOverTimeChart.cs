using System.Collections.Immutable;
using Foldwise.Core.Search;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>When each family last improved: its best out-of-fold score so far against minutes since the search began (each finished trial is a step).</summary>
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
                .Where(t => t.Family == family && t.State == TrialState.Done && t.AllFolds && t.Score is not null && t.Finished is not null)
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
            "When each family last improved",
            "Each step down is a finished trial that beat its family's best so far. A family whose last step came early had stopped finding better candidates, so more hours would buy it little; steps until the end say the budget ran out first.",
            ChartSvg.Render(plot, Id),
            series.ToImmutable());
    }
}
