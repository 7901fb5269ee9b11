using System.Collections.Immutable;
using System.Globalization;
using System.Net;
using System.Text;
using Foldwise.Core.Blending;

namespace Foldwise.Cli.Report;

/// <summary>
/// The blend's diversity in numbers: the correlation of every pair of pooled members' out-of-fold predictions, as a
/// table (members in pool order, each labelled with its family and weight). The reading gives the mean correlation
/// within a family and between families: near 1 means the members make the same errors and blending gains little.
/// </summary>
public static class CorrelationTable
{
    public const string Id = "oof-correlations";

    /// <param name="vectors">Each pooled member's out-of-fold predictions, in <see cref="BlendSummary.Members"/> order.</param>
    public static ChartSection Build(StoredSearch search, IReadOnlyList<double[]>? vectors)
    {
        var blend = search.Blend;
        var series = ImmutableSortedDictionary.CreateBuilder<string, int>();
        if (blend is null || vectors is null || vectors.Count == 0)
        {
            return new ChartSection(Id, "How alike the pooled members' predictions are", "No blend is stored yet, so there is no pool to compare.", "<p class=\"empty\">No blend.</p>", series.ToImmutable());
        }

        var members = blend.Members;
        var r = OutOfFoldCorrelations.Of(vectors);
        var html = new StringBuilder("<table class=\"names\"><thead><tr><th>OOF correlation</th>");
        foreach (var m in members)
        {
            html.Append(CultureInfo.InvariantCulture, $"<th>{m.TrialId}</th>");
        }

        html.Append("</tr></thead><tbody>");
        for (int i = 0; i < members.Length; i++)
        {
            html.Append(CultureInfo.InvariantCulture, $"<tr><td>trial {members[i].TrialId} {WebUtility.HtmlEncode(members[i].Family)} (weight {members[i].Weight:F3})</td>");
            for (int j = 0; j < members.Length; j++)
            {
                string cell = double.IsNaN(r[i, j]) ? "–" : r[i, j].ToString("F3", CultureInfo.InvariantCulture);
                html.Append("<td>").Append(cell).Append("</td>");
            }

            html.Append("</tr>");
        }

        html.Append("</tbody></table>");
        series.Add("members", members.Length);
        var (within, between) = (Mean(members, r, same: true), Mean(members, r, same: false));
        string reading =
            "Mean correlation of out-of-fold predictions between members of one family " + Text(within) + ", between members of different families " + Text(between) + ". " +
            "Members near 1 make the same errors, so the blend gains little from them; a family that correlates less with the others is where a blend finds its gain.";
        return new ChartSection(Id, "How alike the pooled members' predictions are", reading, html.ToString(), series.ToImmutable());
    }

    private static double Mean(IReadOnlyList<BlendMember> members, double[,] r, bool same)
    {
        var values = new List<double>();
        for (int i = 0; i < members.Count; i++)
        {
            for (int j = i + 1; j < members.Count; j++)
            {
                if ((members[i].Family == members[j].Family) == same && !double.IsNaN(r[i, j]))
                {
                    values.Add(r[i, j]);
                }
            }
        }

        return values.Count == 0 ? double.NaN : values.Average();
    }

    private static string Text(double value) => double.IsNaN(value) ? "(no such pair)" : value.ToString("F3", CultureInfo.InvariantCulture);
}
