using System.Collections.Immutable;
using System.Globalization;
using System.Net;
using Foldwise.Core.Screening;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>What screening kept and dropped, and why: one bar per outcome, then up to 12 dropped columns by name.</summary>
public static class ScreeningSummary
{
    public const string Id = "screening";
    private const int NamesShown = 12;

    public static ChartSection Build(StoredSearch search)
    {
        var report = search.Screening;
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        if (report is null)
        {
            return new ChartSection(Id, "Screening", "No screening report is stored.", "<p class=\"empty\">No screening report.</p>", series.ToImmutable());
        }

        var outcomes = new (string Name, int Count)[]
        {
            ("kept", report.Kept.Length),
            ("constant", report.Count(DropReason.Constant)),
            ("duplicate", report.Count(DropReason.Duplicate)),
            ("too few non-zero", report.Count(DropReason.TooFewNonZero)),
        };
        var plot = new Plot();
        var plotted = plot.Add.Bars(outcomes.Select((o, i) => new Bar
        {
            Position = i,
            Value = o.Count,
            FillColor = i == 0 ? Color.FromHex("#009E73") : Color.FromHex("#999999"),
            Label = o.Count.ToString("N0", CultureInfo.InvariantCulture),
        }).ToList());
        plotted.Horizontal = true;
        plot.Axes.Left.SetTicks([.. outcomes.Select((_, i) => (double)i)], [.. outcomes.Select(o => o.Name)]);
        plot.Axes.Margins(left: 0);
        plot.XLabel($"columns (of {report.ColumnsRead:N0} read)");
        foreach (var (name, count) in outcomes)
        {
            series.Add(name, count);
        }

        var rows = report.Dropped.Take(NamesShown).Select(d =>
            $"<tr><td>{WebUtility.HtmlEncode(d.Name)}</td><td>{Reason(d)}</td></tr>");
        string more = report.Dropped.Length > NamesShown ? $"<p>… and {report.Dropped.Length - NamesShown:N0} more dropped columns (see the store's screening report).</p>" : "";
        string table = report.Dropped.Length == 0 ? "" :
            $"<table class=\"names\"><thead><tr><th>dropped column</th><th>why</th></tr></thead><tbody>{string.Concat(rows)}</tbody></table>{more}";
        return new ChartSection(
            Id,
            "Columns kept and dropped before any learner saw them",
            "Columns dropped here never reached a learner: constant and duplicate columns carry nothing new, nearly-empty ones too little to split on; a large drop count is expected on wide sparse tables, a surprising name in the list is worth a question to whoever built the table.",
            ChartSvg.Render(plot, Id, ChartSvg.Width, 240) + table,
            series.ToImmutable());
    }

    private static string Reason(DroppedColumn d) => d.Reason switch
    {
        DropReason.Constant => "constant",
        DropReason.Duplicate => "repeats " + WebUtility.HtmlEncode(d.SameAs ?? "an earlier column"),
        _ => "too few non-zero cells",
    };
}
