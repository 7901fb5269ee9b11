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
            ("all missing", report.Count(DropReason.AllMissing)),
            ("nearly unique text", report.Count(DropReason.NearlyUnique)),
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
        table += Inputs(report, search.Definition.Families);
        return new ChartSection(
            Id,
            "Columns kept and dropped before any learner saw them",
            "Columns dropped here never reached a learner: constant and duplicate columns carry nothing new, nearly-empty ones too little to split on; a large drop count is expected on wide sparse tables, a surprising name in the list is worth a question to whoever built the table.",
            ChartSvg.Render(plot, Id, ChartSvg.Width, 240) + table,
            series.ToImmutable());
    }

    /// <summary>Each kept category column (levels, encoding, gaps, new test levels) and each numeric column with gaps.</summary>
    private static string Inputs(ScreeningReport report, IReadOnlyList<Core.Definition.FamilySearch> families)
    {
        if (report.Categories.Length == 0 && report.Gaps.Length == 0)
        {
            return "";
        }

        var rows = report.Categories.Select(c =>
                $"<tr><td>{WebUtility.HtmlEncode(c.Name)}</td><td>category: {c.Levels:N0} levels, {c.LevelsKept:N0} kept</td>" +
                $"<td>{WebUtility.HtmlEncode(ColumnNotes.Encoding(c.Encoding, families, Short))}</td>" +
                $"<td>{c.MissingShare.ToString("P1", CultureInfo.InvariantCulture)}</td><td>{c.NewTestLevels:N0} in {c.NewTestRows:N0} rows</td></tr>")
            .Concat(report.Gaps.Take(NamesShown).Select(g =>
                $"<tr><td>{WebUtility.HtmlEncode(g.Name)}</td><td>numeric</td><td>missing kept; median + indicator for families without NaN</td>" +
                $"<td>{g.MissingShare.ToString("P1", CultureInfo.InvariantCulture)}</td><td></td></tr>"));
        string more = report.Gaps.Length > NamesShown ? $"<p>… and {report.Gaps.Length - NamesShown:N0} more numeric columns with gaps.</p>" : "";
        return "<table class=\"names\"><thead><tr><th>column</th><th>kind</th><th>encoding (fitted inside each fold)</th><th>missing</th><th>new test levels</th></tr></thead>" +
            $"<tbody>{string.Concat(rows)}</tbody></table>{more}";
    }

    private static string Short(Core.Encodings.CategoryEncodingKind kind) => kind switch
    {
        Core.Encodings.CategoryEncodingKind.Indicators => "indicator per level",
        Core.Encodings.CategoryEncodingKind.TargetMean => "smoothed target mean (inner folds)",
        _ => "level codes, LightGBM's category splits",
    };

    private static string Reason(DroppedColumn d) => d.Reason switch
    {
        DropReason.Constant => "constant",
        DropReason.Duplicate => "repeats " + WebUtility.HtmlEncode(d.SameAs ?? "an earlier column"),
        DropReason.AllMissing => "every cell missing",
        DropReason.NearlyUnique => "nearly every level unique (free text or an id)",
        _ => "too few non-zero cells",
    };
}
