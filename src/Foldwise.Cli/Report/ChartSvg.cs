using System.Text.RegularExpressions;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>Renders a ScottPlot plot as SVG markup ready to inline in the page.</summary>
public static partial class ChartSvg
{
    public const int Width = 1000;
    public const int Height = 380;
    public const int SmallWidth = 400;
    public const int SmallHeight = 280;

    /// <summary>
    /// The SVG without its XML declaration, with every internal id prefixed by <paramref name="chartId"/>:
    /// several inline SVGs share one document, and two clip paths with one id would clip each other's chart.
    /// </summary>
    public static string Render(Plot plot, string chartId, bool small = false) =>
        Render(plot, chartId, small ? SmallWidth : Width, small ? SmallHeight : Height);

    public static string Render(Plot plot, string chartId, int width, int height)
    {
        ArgumentNullException.ThrowIfNull(plot);
        plot.FigureBackground.Color = Colors.White;
        plot.Font.Set("DejaVu Sans");
        string svg = plot.GetSvgXml(width, height);
        svg = XmlDeclaration().Replace(svg, "");

        // A viewBox lets the page scale the chart down to a narrow column instead of cropping it.
        svg = SvgOpening().Replace(svg, m => $"{m.Value} viewBox=\"0 0 {width} {height}\"", 1);
        svg = IdAttribute().Replace(svg, m => $"id=\"{chartId}-{m.Groups[1].Value}\"");
        svg = UrlReference().Replace(svg, m => $"url(#{chartId}-{m.Groups[1].Value})");
        svg = HrefReference().Replace(svg, m => $"{m.Groups[1].Value}=\"#{chartId}-{m.Groups[2].Value}\"");
        return svg.Trim();
    }

    [GeneratedRegex(@"<\?xml[^>]*\?>")]
    private static partial Regex XmlDeclaration();

    [GeneratedRegex("<svg(?![^>]*viewBox)")]
    private static partial Regex SvgOpening();

    [GeneratedRegex("id=\"([^\"]+)\"")]
    private static partial Regex IdAttribute();

    [GeneratedRegex(@"url\(#([^)]+)\)")]
    private static partial Regex UrlReference();

    [GeneratedRegex("((?:xlink:)?href)=\"#([^\"]+)\"")]
    private static partial Regex HrefReference();
}
