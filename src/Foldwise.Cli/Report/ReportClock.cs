namespace Foldwise.Cli.Report;

/// <summary>The report's time axis: minutes since the first trial started (or the search was created, before any).</summary>
public static class ReportClock
{
    public static DateTimeOffset Origin(StoredSearch search)
    {
        ArgumentNullException.ThrowIfNull(search);
        var starts = search.Trials.Where(t => t.Started is not null).Select(t => t.Started!.Value).ToList();
        return starts.Count == 0 ? search.Header.Created : starts.Min();
    }

    public static double Minutes(DateTimeOffset origin, DateTimeOffset at) => (at - origin).TotalMinutes;
}
