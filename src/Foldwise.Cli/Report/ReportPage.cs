using System.Globalization;
using System.Net;
using System.Text;
using System.Text.Json;
using Foldwise.Cli.Output;
using Foldwise.Core.Definition;
using Foldwise.Core.Search;

namespace Foldwise.Cli.Report;

/// <summary>
/// Assembles the report: one HTML file with its style and every chart inline (SVG), loading nothing from the
/// network, so it opens anywhere and can be attached to a review. Each part is a <c>section.part</c> with its
/// heading and question; each chart a <c>section.chart</c> with an id and a <c>data-series</c> JSON object
/// (series name → point count).
/// </summary>
public static class ReportPage
{
    public static string Html(StoredSearch search, IReadOnlyList<ReportPart> parts, DateTimeOffset written)
    {
        ArgumentNullException.ThrowIfNull(search);
        ArgumentNullException.ThrowIfNull(parts);
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
        foreach (var part in parts.Where(p => p.Charts.Count > 0))
        {
            page.Append(CultureInfo.InvariantCulture, $"""
                <section class="part" id="part-{part.Id}"><h2 class="part">{WebUtility.HtmlEncode(part.Heading)}</h2>
                <p class="question">{part.QuestionHtml}</p>
                {(part.IsGrid ? "<div class=\"grid\">" : "")}
                """);
            foreach (var chart in part.Charts)
            {
                string series = WebUtility.HtmlEncode(JsonSerializer.Serialize(chart.Series));
                page.Append(CultureInfo.InvariantCulture, $"""
                    <section class="chart{(chart.Small ? " small" : "")}" id="{chart.Id}" data-chart="{chart.Id}" data-series="{series}">
                    <h3>{WebUtility.HtmlEncode(chart.Title)}</h3>
                    <p class="reading">{WebUtility.HtmlEncode(chart.Reading)}</p>
                    <figure>{chart.Body}</figure>
                    </section>
                    """);
            }

            page.Append(part.IsGrid ? "</div></section>" : "</section>");
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

    /// <summary>Each family's colour swatch and name, as HTML, to name the colours of charts that carry no legend.</summary>
    public static string Swatches(StoredSearch search)
    {
        ArgumentNullException.ThrowIfNull(search);
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        return string.Join(", ", families.Select(f =>
            $"<span class=\"swatch\" style=\"background:{FamilyColors.HexFor(families, f)}\"></span>{WebUtility.HtmlEncode(f)}"));
    }

    private static string Facts(StoredSearch search, DateTimeOffset written)
    {
        var t = search.Trials;
        var schedule = search.Definition.Schedule;
        int done = t.Count(x => x.State == TrialState.Done);
        string best = t.Where(x => x.Score is not null && x.AllFolds).Select(x => x.Score!.Value).DefaultIfEmpty(double.NaN).Min().ToString("F5", CultureInfo.InvariantCulture);
        string blend = search.Blend is { } b ? string.Create(CultureInfo.InvariantCulture, $"; blend nested estimate {b.NestedScore:F5}") : "; no blend yet";
        return WebUtility.HtmlEncode(string.Create(CultureInfo.InvariantCulture,
            $"{t.Count} trials ({done} done, {t.Count(x => x.State == TrialState.Failed)} failed) of {string.Join(" and ", search.Definition.Families.Select(f => f.Family))} " +
            $"by {DefinitionWords.Of(schedule.Kind)} with {DefinitionWords.Of(schedule.Proposer)}, {FamilyRungs.Describe(search.Definition)}, " +
            $"{search.Definition.Folds}-fold {search.Metric.Name}, best single trial {best}{blend}; " +
            $"{(search.Header.Finished ? "finished" : "not finished")} after {TimeSpan.FromSeconds(Math.Round(search.Header.SpentSeconds))}. Written {written:yyyy-MM-dd HH:mm} UTC from {search.StorePath}."));
    }
}
