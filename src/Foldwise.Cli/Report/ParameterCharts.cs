using System.Collections.Immutable;
using System.Globalization;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>
/// Whether each searched parameter's range was well placed: one small chart per parameter, score against the
/// parameter's value over its range, coloured by family. Each candidate appears once, at its first evaluation (a new
/// candidate, not a promotion), so points share a budget and compare fairly. Parameters keep the definition's
/// order; at most <see cref="MaxCharts"/> are drawn.
/// </summary>
public static class ParameterCharts
{
    public const int MaxCharts = 8;

    public static IReadOnlyList<ChartSection> Build(StoredSearch search)
    {
        var families = search.Definition.Families.Select(f => f.Family).ToList();
        var firsts = search.Trials.Where(t => t.ParentId is null && t.State == TrialState.Done && t.Score is not null).ToList();
        var names = search.Definition.Families
            .SelectMany(f => f.Space.Ranges.Where(r => !r.IsFixed).Select(r => r.Name))
            .Distinct()
            .Take(MaxCharts);
        return [.. names.Select(n => Chart(search, families, firsts, n))];
    }

    private static ChartSection Chart(StoredSearch search, List<string> families, List<TrialRecord> firsts, string name)
    {
        var scored = firsts.Where(t => t.Parameters.Values.ContainsKey(name)).ToList();
        string id = "param-" + new string([.. name.Select(c => char.IsAsciiLetterOrDigit(c) ? c : '-')]);
        var plot = new Plot();
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        ParameterRange? shown = null;
        foreach (string family in families)
        {
            var range = search.SpaceOf(family)?.Find(name);
            var points = firsts.Where(t => t.Family == family && t.Parameters.Values.ContainsKey(name)).ToList();
            if (range is null || range.IsFixed || points.Count == 0)
            {
                continue;
            }

            shown ??= range;
            var xs = points.Select(t => Position(range, t.Parameters[name])).ToArray();
            var ys = points.Select(t => t.Score!.Value).ToArray();
            var dots = plot.Add.ScatterPoints(xs, ys, FamilyColors.For(families, family));
            dots.MarkerSize = 7;
            dots.LegendText = family;
            series.Add(family, xs.Length);
        }

        if (shown is { Kind: ParameterKind.OneOf })
        {
            plot.Axes.Bottom.SetTicks([.. Enumerable.Range(0, shown.Choices.Length).Select(i => (double)i)], [.. shown.Choices]);
        }

        // The page names the family colours above the grid; a legend in a small chart would hide its points.
        plot.HideLegend();
        plot.XLabel(shown is { Kind: ParameterKind.Log } ? $"{name} (log10)" : name);
        plot.YLabel(search.Metric.Name);
        return new ChartSection(
            id,
            $"{name} within its range",
            Reading(shown, scored, name),
            ChartSvg.Render(plot, id, small: true),
            series.ToImmutable(),
            Small: true);
    }

    private static string Reading(ParameterRange? range, List<TrialRecord> scored, string name)
    {
        string strength = Strength(scored, name).ToString("F2", CultureInfo.InvariantCulture);
        string follows = $"Rank correlation with the score {strength} (0 = no pattern, 1 = the score follows {name} closely).";
        if (range is null || scored.Count == 0)
        {
            return follows + " No candidate has a score yet.";
        }

        var best = scored.MinBy(t => t.Score!.Value)!;
        double value = best.Parameters[name];
        if (range.Kind == ParameterKind.OneOf)
        {
            return $"{follows} The best candidate so far took {range.Display(value)}.";
        }

        double share = (Position(range, value) - Position(range, range.Low)) / (Position(range, range.High) - Position(range, range.Low));
        string where = share <= 0.1 ? "near the low end: lower values may do better still"
            : share >= 0.9 ? "near the high end: higher values may do better still"
            : "inside it, away from both ends";
        return string.Create(CultureInfo.InvariantCulture,
            $"{follows} The best candidate so far took {range.Display(value)}, {share:P0} of the way through the range {range.Display(range.Low)} to {range.Display(range.High)}: {where}.");
    }

    private static double Position(ParameterRange range, double value) =>
        range.Kind == ParameterKind.Log && value > 0 ? Math.Log10(value) : value;

    /// <summary>|Spearman rank correlation| of the parameter with the score; 0 with fewer than 3 points.</summary>
    public static double Strength(IReadOnlyList<TrialRecord> trials, string name)
    {
        if (trials.Count < 3)
        {
            return 0;
        }

        var x = Ranks([.. trials.Select(t => t.Parameters[name])]);
        var y = Ranks([.. trials.Select(t => t.Score!.Value)]);
        double mx = x.Average(), my = y.Average(), sxy = 0, sxx = 0, syy = 0;
        for (int i = 0; i < x.Length; i++)
        {
            sxy += (x[i] - mx) * (y[i] - my);
            sxx += (x[i] - mx) * (x[i] - mx);
            syy += (y[i] - my) * (y[i] - my);
        }

        return sxx == 0 || syy == 0 ? 0 : Math.Abs(sxy / Math.Sqrt(sxx * syy));
    }

    // Average ranks for ties, as Spearman's coefficient takes them.
    private static double[] Ranks(double[] values)
    {
        var order = Enumerable.Range(0, values.Length).OrderBy(i => values[i]).ToArray();
        var ranks = new double[values.Length];
        for (int i = 0; i < order.Length;)
        {
            int j = i;
            while (j + 1 < order.Length && values[order[j + 1]] == values[order[i]])
            {
                j++;
            }

            for (int k = i; k <= j; k++)
            {
                ranks[order[k]] = (i + j) / 2.0;
            }

            i = j + 1;
        }

        return ranks;
    }
}
