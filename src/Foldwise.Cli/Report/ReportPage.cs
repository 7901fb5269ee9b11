using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using Foldwise.Core.Search;

namespace Foldwise.Cli.Report;

/// <summary>
/// Assembles the report: one HTML file with its style and every chart inline (SVG), loading nothing from the
/// network, so it opens anywhere and can be attached to a review. Each chart is a <c>section.chart</c> with an id
/// and a <c>data-series</c> JSON object (series name → point count).
/// </summary>
public static class ReportPage
{
    public static string Html(StoredSearch search, IReadOnlyList<ChartSection> charts, DateTimeOffset written)
    {
        ArgumentNullException.ThrowIfNull(search);
        ArgumentNullException.ThrowIfNull(charts);
        var page = new StringBuilder();
        string name = WebUtility.HtmlEncode(search.Definition.Name);
        page.Append(CultureInfo.InvariantCulture, $"""
            <!DOCTYPE html>
            <html lang="en"><head><meta charset="utf-8">
            <meta name="viewport" content="width=device-width, initial-scale=1">
            <title>Foldwise report: {name}</title>
            <style>{ReportStyle.Css}</style>
            </head><body>
            <header><h1>Search <q>{name}</q></h1><p class="facts">{Facts(search, written)}</p></header>
            <main>
            """);
        bool inGrid = false;
        foreach (var chart in charts)
        {
            if (chart.Small != inGrid)
            {
                page.Append(chart.Small
                    ? "<section class=\"grid-intro\"><h2>Score against each parameter</h2><p class=\"reading\">Each candidate's first evaluation, coloured by family (" + Swatches(search) + "); most telling parameter first.</p></section><div class=\"grid\">"
                    : "</div>");
                inGrid = chart.Small;
            }

            string series = WebUtility.HtmlEncode(JsonSerializer.Serialize(chart.Series));
            page.Append(CultureInfo.InvariantCulture, $"""
                <section class="chart{(chart.Small ? " small" : "")}" id="{chart.Id}" data-chart="{chart.Id}" data-series="{series}">
                <h2>{WebUtility.HtmlEncode(chart.Title)}</h2>
                <p class="reading">{WebUtility.HtmlEncode(chart.Reading)}</p>
                <figure>{chart.Body}</figure>
                </section>
                """);
        }

        if (inGrid)
        {
            page.Append("</div>");
        }

        page.Append("</main>").Append(ReportStyle.Footer).Append("</body></html>\n");
        return page.ToString();
    }

    /// <summary>Writes the page to a temporary file beside <paramref name="path"/>, then moves it into place, so a reader never sees half a page.</summary>
    public static void WriteAtomically(string path, string html)
    {
        string full = Path.GetFullPath(path);
        Directory.CreateDirectory(Path.GetDirectoryName(full)!);
        string temp = full + $".{Environment.ProcessId}.tmp";
        try
        {
            File.WriteAllText(temp, html, new UTF8Encoding(encoderShouldEmitUTF8Identifier: false));
            File.Move(temp, full, overwrite: true);
        }
        finally
        {
            File.Delete(temp);
        }
    }

    private static string Swatches(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        return string.Join(", ", families.Select(f =>
            $"<span class=\"swatch\" style=\"background:{FamilyColors.HexFor(families, f)}\"></span>{WebUtility.HtmlEncode(f)}"));
    }

    private static string Facts(StoredSearch search, DateTimeOffset written)
    {
        var t = search.Trials;
        int done = t.Count(x => x.State == TrialState.Done);
        string best = t.Where(x => x.Score is not null).Select(x => x.Score!.Value).DefaultIfEmpty(double.NaN).Min().ToString("F5", CultureInfo.InvariantCulture);
        string blend = search.Blend is { } b ? string.Create(CultureInfo.InvariantCulture, $"; blend nested estimate {b.NestedScore:F5}") : "; no blend yet";
        return WebUtility.HtmlEncode(string.Create(CultureInfo.InvariantCulture,
            $"{t.Count} trials ({done} done, {t.Count(x => x.State == TrialState.Failed)} failed) of {string.Join(" and ", search.Definition.Families.Select(f => f.Family))}, " +
            $"{search.Definition.Folds}-fold {search.Metric.Name}, best single trial {best}{blend}; " +
            $"{(search.Header.Finished ? "finished" : "not finished")} after {TimeSpan.FromSeconds(Math.Round(search.Header.SpentSeconds))}. Written {written:yyyy-MM-dd HH:mm} UTC from {search.StorePath}."));
    }
}
