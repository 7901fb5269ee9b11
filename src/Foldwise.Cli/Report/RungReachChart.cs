using System.Collections.Immutable;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>How many candidates reached each rung, per family: grouped bars, rung on the x axis (with its rounds).</summary>
public static class RungReachChart
{
    public const string Id = "rung-reach";

    public static ChartSection Build(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var rungs = search.Trials.Select(t => t.Rung).Distinct().Order().ToList();
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        double width = 0.8 / Math.Max(1, families.Count);
        for (int f = 0; f < families.Count; f++)
        {
            var bars = new List<Bar>();
            foreach (int rung in rungs)
            {
                int reached = search.Trials.Count(t => t.Family == families[f] && t.Rung == rung);
                bars.Add(new Bar
                {
                    Position = rung - 0.4 + (width * (f + 0.5)),
                    Value = reached,
                    Size = width * 0.9,
                    FillColor = FamilyColors.For(families, families[f]),
                    Label = reached.ToString(System.Globalization.CultureInfo.InvariantCulture),
                });
            }

            var plotted = plot.Add.Bars(bars);
            plotted.LegendText = families[f];
            plotted.Color = FamilyColors.For(families, families[f]);
            series.Add(families[f], bars.Count);
        }

        var ticks = rungs.Select(r => $"rung {r} ({ReachAt(search, r)})").ToArray();
        plot.Axes.Bottom.SetTicks([.. rungs.Select(r => (double)r)], ticks);
        plot.Axes.Margins(bottom: 0);
        plot.YLabel("candidates that ran at this rung");
        plot.ShowLegend(Alignment.UpperRight);
        return new ChartSection(
            Id,
            "Candidates reaching each rung",
            $"Each step right is a promotion to more {(search.Definition.Schedule.ByFolds ? "folds" : "rounds")}; the drop from one bar to the next is how many candidates were stopped early because they scored worse than their peers at the same budget.",
            ChartSvg.Render(plot, Id),
            series.ToImmutable());
    }

    /// <summary>What a rung's trials trained: rounds, or folds when the schedule screens on folds.</summary>
    private static string ReachAt(StoredSearch search, int rung)
    {
        var at = search.Trials.Where(t => t.Rung == rung).ToList();
        if (search.Definition.Schedule.ByFolds)
        {
            int folds = at.Select(t => t.AllFolds ? search.Definition.Folds : t.Folds).DefaultIfEmpty(search.Definition.Folds).Max();
            return string.Create(System.Globalization.CultureInfo.InvariantCulture, $"{folds} fold{(folds == 1 ? "" : "s")}");
        }

        var budgets = at.Select(t => t.Budget).Distinct().Order().ToList();
        return budgets.Count == 1 ? $"{budgets[0].ToString(System.Globalization.CultureInfo.InvariantCulture)} rounds" : $"{budgets.First()}–{budgets.Last()} rounds";
    }
}
