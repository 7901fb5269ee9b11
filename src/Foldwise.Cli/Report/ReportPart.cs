namespace Foldwise.Cli.Report;

/// <summary>
/// One part of the report: a heading, the question it answers for a lead (HTML, may hold colour swatches), and its
/// charts. A part of small charts lays them out in a grid.
/// </summary>
public sealed record ReportPart(string Id, string Heading, string QuestionHtml, IReadOnlyList<ChartSection> Charts)
{
    public bool IsGrid => Charts.Count > 0 && Charts.All(c => c.Small);
}
