using System.Diagnostics;
using Foldwise.Core.Blending;
using Foldwise.Core.Events;
using Foldwise.Core.Search;

namespace Foldwise.Bench.WholeSearch;

/// <summary>Keeps what the summary needs from the search's events, and when each phase ended; prints one line a minute while trials run.</summary>
internal sealed class EventTally : IProgress<SearchEvent>
{
    private readonly object gate = new();
    private readonly Stopwatch clock = Stopwatch.StartNew();
    private int scored;
    private int failedAttempts;
    private TimeSpan nextLine = TimeSpan.FromMinutes(1);

    public TimeSpan? Started { get; private set; }

    public TimeSpan? Stopped { get; private set; }

    public TimeSpan? Blended { get; private set; }

    public TimeSpan? Kept { get; private set; }

    public SearchProgress? Progress { get; private set; }

    public BlendSummary? Blend { get; private set; }

    public IReadOnlyList<TrialRecord> Trials { get; private set; } = [];

    public string Keeping { get; private set; } = "";

    public int FailedAttempts
    {
        get
        {
            lock (gate)
            {
                return failedAttempts;
            }
        }
    }

    public TimeSpan Elapsed => clock.Elapsed;

    public void Report(SearchEvent value)
    {
        lock (gate)
        {
            switch (value)
            {
                case SearchStarted:
                    Started = clock.Elapsed;
                    break;
                case TrialScored s:
                    scored++;
                    if (Started is { } start && clock.Elapsed - start >= nextLine)
                    {
                        Console.WriteLine($"  {(clock.Elapsed - start).TotalMinutes:F1} min: {scored} trials scored, best {s.Progress.Best:F5}");
                        nextLine += TimeSpan.FromMinutes(1);
                    }

                    break;
                case AttemptFailed f:
                    failedAttempts++;
                    Console.WriteLine($"  trial {f.TrialId} attempt {f.Attempt} failed: {f.Reason}");
                    break;
                case SearchStopped s:
                    Stopped = clock.Elapsed;
                    Progress = s.Progress;
                    break;
                case BlendSolved b:
                    Blended = clock.Elapsed;
                    Blend = b.Summary;
                    Trials = b.Trials;
                    break;
                case ModelsKept k:
                    Kept = clock.Elapsed;
                    Keeping = $"models kept ({k.Refitted} re-fitted)";
                    break;
                case ModelsNotKept n:
                    Kept = clock.Elapsed;
                    Keeping = $"models not kept: {n.Reason}";
                    break;
            }
        }
    }
}
