using System.Collections.Immutable;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>
/// The blend's out-of-fold predictions (weights × each member's out-of-fold vector) against the actual target,
/// both on the fitting scale (log1p under RMSLE), beside the residuals (actual − predicted) against the prediction.
/// </summary>
public static class OutOfFoldChart
{
    public const string Id = "oof-fit";

    /// <param name="blended">The blended out-of-fold vector, or null when no blend is stored.</param>
    public static ChartSection Build(StoredSearch search, double[]? blended)
    {
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        string scale = search.Metric.UsesLogScale ? "log1p" : "original scale";
        string body = "<p class=\"empty\">No blend is stored yet.</p>";
        if (blended is not null)
        {
            var actual = search.Header.TrainTarget.Select(search.Metric.Forward).ToArray();
            var residuals = actual.Select((a, i) => a - blended[i]).ToArray();
            body = Panel(FitPlot(blended, actual, scale), Id + "-fit") + Panel(ResidualPlot(blended, residuals, scale), Id + "-residuals");
            series.Add("predicted-vs-actual", blended.Length);
            series.Add("residuals", residuals.Length);
        }

        return new ChartSection(
            Id,
            "The blend on rows it never trained on",
            "Points on the dashed line are predicted exactly; a residual cloud that tilts or fans out shows where the model is biased (typically it pulls extreme targets towards the middle), which the single score hides.",
            $"<div class=\"pair\">{body}</div>",
            series.ToImmutable());
    }

    private static string Panel(Plot plot, string id) => ChartSvg.Render(plot, id, ChartSvg.Width / 2, ChartSvg.Height + 40);

    private static Plot FitPlot(double[] predicted, double[] actual, string scale)
    {
        var plot = new Plot();
        var dots = plot.Add.ScatterPoints(predicted, actual, Color.FromHex("#0072B2").WithAlpha(0.4));
        dots.MarkerSize = 4;
        double lo = Math.Min(actual.Min(), predicted.Min()), hi = Math.Max(actual.Max(), predicted.Max());
        var diagonal = plot.Add.Line(lo, lo, hi, hi);
        diagonal.Color = Colors.Black;
        diagonal.LinePattern = LinePattern.Dashed;
        plot.Title("predicted vs actual", size: 13);
        plot.XLabel($"blended OOF prediction ({scale})");
        plot.YLabel($"actual ({scale})");
        return plot;
    }

    private static Plot ResidualPlot(double[] predicted, double[] residuals, string scale)
    {
        var plot = new Plot();
        var dots = plot.Add.ScatterPoints(predicted, residuals, Color.FromHex("#D55E00").WithAlpha(0.4));
        dots.MarkerSize = 4;
        var zero = plot.Add.HorizontalLine(0);
        zero.Color = Colors.Black;
        zero.LinePattern = LinePattern.Dashed;
        plot.Title("residuals", size: 13);
        plot.XLabel($"blended OOF prediction ({scale})");
        plot.YLabel("actual − predicted");
        return plot;
    }
}
