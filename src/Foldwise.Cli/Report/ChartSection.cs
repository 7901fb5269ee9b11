using System.Collections.Immutable;

namespace Foldwise.Cli.Report;

/// <summary>
/// One chart of the report: its element id, title, the sentence saying what a lead reads from it, the inline
/// SVG (or HTML table), and its series with their point counts, written to the page as <c>data-series</c>
/// so a test can check the chart against the store.
/// </summary>
public sealed record ChartSection(
    string Id,
    string Title,
    string Reading,
    string Body,
    ImmutableSortedDictionary<string, int> Series,
    bool Small = false);
