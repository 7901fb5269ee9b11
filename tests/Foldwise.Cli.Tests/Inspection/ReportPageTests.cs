using System.Net;
using System.Text.Json;
using System.Text.RegularExpressions;
using Foldwise.Testing;
using Xunit.Abstractions;

namespace Foldwise.Cli.Tests.Inspection;

[Trait(Lane.Key, Lane.Slow)]
public sealed partial class ReportPageTests(ITestOutputHelper output) : IDisposable
{
    private readonly InspectedStore store = new(finished: true);

    public void Dispose() => store.Dispose();

    [Fact]
    public void Report_is_one_self_contained_page_whose_charts_match_the_store_and_open_in_a_browser_cleanly()
    {
        // Given a finished search's store
        string page = Path.Combine(store.Folder, "report.html");

        // When a lead writes its report
        var run = CliHarness.Run("report", store.Path, "--out", page);

        // Then one HTML file is written in one move (no temporary file left beside it)
        Assert.True(run.ExitCode == 0, run.Output);
        Assert.Contains("Wrote", run.Output);
        Assert.Equal(["report.html", "search.db"], Directory.GetFiles(store.Folder).Select(Path.GetFileName).Where(n => !n!.EndsWith(".lock", StringComparison.Ordinal)).Order());
        string html = File.ReadAllText(page);

        // And it loads nothing from elsewhere: no linked style, script, image or font; "http" only in SVG namespaces
        Assert.DoesNotMatch(@"<link|<script[^>]*src|<img|<iframe|@import|url\((?!#)", html);
        Assert.All(HttpMentions().Matches(html), m => Assert.Matches(@"^http://www\.w3\.org/(2000/svg|1999/xlink)$", m.Value));

        // And each chart's series are those of the store (series → points)
        var charts = Charts(html);
        Assert.Equal(new Dictionary<string, int> { ["fasttree"] = 1, ["lightgbm"] = 2 }, charts["best-over-time"]);
        Assert.Equal(new Dictionary<string, int> { ["fasttree"] = 2, ["lightgbm"] = 2 }, charts["rung-reach"]);
        Assert.Equal(new Dictionary<string, int> { ["fasttree"] = 1, ["lightgbm"] = 2 }, charts["blend-weights"]);
        Assert.Equal(new Dictionary<string, int> { ["predicted-vs-actual"] = 12, ["residuals"] = 12 }, charts["oof-fit"]);
        Assert.Equal(new Dictionary<string, int> { ["w1/0"] = 1, ["w1/1"] = 2, ["w2/0"] = 1, ["w2/1"] = 1 }, charts["timeline"]);
        Assert.Equal(new Dictionary<string, int> { ["constant"] = 1, ["duplicate"] = 1, ["kept"] = 3, ["too few non-zero"] = 0, ["all missing"] = 0, ["nearly unique text"] = 0 }, charts["screening"]);
        Assert.Equal(new Dictionary<string, int> { ["fasttree"] = 1, ["lightgbm"] = 2 }, charts["noise-floor"]);

        // And it opens with the project's own views: how far candidates got, the noise floor, the blend and its diversity, its fit
        var order = ChartSectionTag().Matches(html).Select(m => m.Groups["id"].Value).ToList();
        Assert.Equal(["rung-reach", "noise-floor", "blend-weights", "oof-correlations", "oof-fit"], order.Take(5));
        Assert.Equal(new Dictionary<string, int> { ["members"] = 3 }, charts["oof-correlations"]);
        Assert.Contains("Mean correlation of out-of-fold predictions between members of one family", html);
        Assert.Contains("2 of 3 pool members from 2 of 2 families carry weight, worth 1.7 equally weighted members", html);

        // And the familiar views follow under the project's questions, not as the lead and not under generic titles
        Assert.Equal(["What the search found", "Were the definition&#39;s ranges well placed?", "How the search spent its time"], PartHeading().Matches(html).Select(m => m.Groups[1].Value));
        Assert.True(order.IndexOf("best-over-time") > order.IndexOf("param-leaves"), "time comes after the ranges");
        Assert.DoesNotContain("Best score over time", html);
        Assert.DoesNotContain("Score against", html);
        Assert.Contains("leaves within its range", html);

        // And one small chart per searched parameter: fasttree has no l2, so that chart shows lightgbm only
        Assert.Equal(["param-feature-fraction", "param-l2", "param-learning-rate", "param-leaves", "param-min-leaf-rows", "param-row-fraction"],
            charts.Keys.Where(k => k.StartsWith("param-", StringComparison.Ordinal)).Order(StringComparer.Ordinal));
        Assert.Equal(new Dictionary<string, int> { ["lightgbm"] = 1 }, charts["param-l2"]);
        Assert.Equal(new Dictionary<string, int> { ["fasttree"] = 1, ["lightgbm"] = 1 }, charts["param-leaves"]);

        // And every chart says what a lead reads from it, and the cautions close the page
        Assert.Equal(charts.Count, Regex.Count(html, "<p class=\"reading\">[^<]{40,}</p>"));
        Assert.Contains("fairness and regulatory review", html);
        Assert.Contains("Foldwise measures accuracy only", html);
        Assert.Contains("A cross-validated score is an estimate", html);

        // When a browser opens it
        string shot = Path.Combine(AppContext.BaseDirectory, "screenshots", "report.png");
        Directory.CreateDirectory(Path.GetDirectoryName(shot)!);
        File.Delete(shot);
        var browser = HeadlessChromium.Open(page, shot);
        output.WriteLine($"Report screenshot: {shot}");

        // Then it renders every chart with no console message, and the screenshot holds a drawn page
        Assert.True(browser.ExitCode == 0, browser.Stderr);
        Assert.Empty(browser.ConsoleLines);
        Assert.True(new FileInfo(shot).Length > 20_000, "the screenshot is nearly empty");
        Assert.Equal(charts.Count, Regex.Count(browser.Dom, "<section class=\"chart[^\"]*\" id=\"[^\"]+\""));
        Assert.Equal(charts.Count, Regex.Count(browser.Dom, "<svg ")); // the OOF chart holds two panels, the correlation table none
    }

    [Fact]
    public void The_browser_check_catches_an_uncaught_script_error()
    {
        // Given a page that throws (a check that could not see this would pass any page)
        string page = Path.Combine(store.Folder, "bad.html");
        File.WriteAllText(page, "<!DOCTYPE html><html><body><script>throw new Error('broken-chart')</script></body></html>");

        // When it is opened
        var browser = HeadlessChromium.Open(page, Path.Combine(store.Folder, "bad.png"), 400, 300);

        // Then the error is reported
        Assert.Contains(browser.ConsoleLines, l => l.Contains("broken-chart", StringComparison.Ordinal));
    }

    private static Dictionary<string, Dictionary<string, int>> Charts(string html) =>
        ChartSectionTag().Matches(html).ToDictionary(
            m => m.Groups["id"].Value,
            m => JsonSerializer.Deserialize<Dictionary<string, int>>(WebUtility.HtmlDecode(m.Groups["series"].Value))!);

    [GeneratedRegex("<section class=\"chart[^\"]*\" id=\"(?<id>[^\"]+)\" data-chart=\"[^\"]+\" data-series=\"(?<series>[^\"]*)\"")]
    private static partial Regex ChartSectionTag();

    [GeneratedRegex("<h2 class=\"part\">([^<]+)</h2>")]
    private static partial Regex PartHeading();

    [GeneratedRegex(@"https?://[^""'\s<>)]+")]
    private static partial Regex HttpMentions();
}
