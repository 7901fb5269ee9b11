using System.Collections.Immutable;
using Foldwise.Core.Search;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>When each trial ran on each machine and slot: one lane per machine/slot, one bar per attempt that started, coloured by family.</summary>
public static class TimelineChart
{
    public const string Id = "timeline";

    public static ChartSection Build(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var origin = ReportClock.Origin(search);
        var placed = search.Trials.Where(t => t.Started is not null && t.Worker is not null).ToList();
        var lanes = placed.Select(Lane).Distinct().Order(StringComparer.Ordinal).ToList();
        var end = placed.Select(t => t.Finished ?? t.Started!.Value).DefaultIfEmpty(origin).Max();
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        foreach (var t in placed)
        {
            int lane = lanes.IndexOf(Lane(t));
            double x0 = ReportClock.Minutes(origin, t.Started!.Value);
            double x1 = ReportClock.Minutes(origin, t.Finished ?? end);
            var bar = plot.Add.Rectangle(x0, Math.Max(x1, x0 + 0.002), lane - 0.35, lane + 0.35);
            bar.FillColor = FamilyColors.For(families, t.Family).WithAlpha(t.State == TrialState.Done ? 1 : 0.45);
            bar.LineColor = Colors.White;
            bar.LineWidth = 0.5f;
        }

        foreach (var lane in placed.GroupBy(Lane))
        {
            series.Add(lane.Key, lane.Count());
        }

        plot.Axes.Left.SetTicks([.. lanes.Select((_, i) => (double)i)], [.. lanes]);
        plot.XLabel("minutes since the search began (pale: not finished or failed)");
        foreach (string family in families)
        {
            plot.Legend.ManualItems.Add(new LegendItem { LabelText = family, FillColor = FamilyColors.For(families, family) });
        }

        plot.ShowLegend(Alignment.UpperRight);
        return new ChartSection(
            Id,
            "Where each slot's hours went",
            "One lane per machine and slot, one bar per trial. Gaps are time a slot sat idle (waiting for promotions or for the coordinator); long bars are the costly full-budget trials.",
            ChartSvg.Render(plot, Id, ChartSvg.Width, Math.Max(200, 90 + (50 * lanes.Count))),
            series.ToImmutable());
    }

    private static string Lane(TrialRecord t) => $"{t.Worker}/{t.Slot}";
}
