using System.Collections.Immutable;
using System.Globalization;
using Foldwise.Core.Search;
using Foldwise.Core.Spaces;
using ScottPlot;

namespace Foldwise.Cli.Report;

/// <summary>
/// Score against each searched parameter, one small chart per parameter, coloured by family. Each candidate
/// appears once, at its first evaluation (a new candidate, not a promotion), so points share a budget and
/// compare fairly. Parameters are ordered by how strongly their rank follows the score's; at most
/// <see cref="MaxCharts"/> are drawn.
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
            .Select(n => (Name: n, Strength: Strength(firsts.Where(t => t.Parameters.Values.ContainsKey(n)).ToList(), n)))
            .OrderByDescending(p => p.Strength)
            .ThenBy(p => p.Name, StringComparer.Ordinal)
            .Take(MaxCharts);
        return [.. names.Select(p => Chart(search, families, firsts, p.Name, p.Strength))];
    }

    private static ChartSection Chart(StoredSearch search, List<string> families, List<TrialRecord> firsts, string name, double strength)
    {
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
            $"Score against {name}",
            $"Rank correlation with the score {strength.ToString("F2", CultureInfo.InvariantCulture)} (0 = no pattern, 1 = the score follows this parameter closely); a clear slope or valley says where in its range this parameter pays.",
            ChartSvg.Render(plot, id, small: true),
            series.ToImmutable(),
            Small: true);
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
