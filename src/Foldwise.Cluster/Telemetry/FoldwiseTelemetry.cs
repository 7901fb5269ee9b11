using System.Diagnostics;

namespace Foldwise.Cluster.Telemetry;

/// <summary>
/// The names Foldwise reports under: one <see cref="ActivitySource"/> and one <see cref="Meter"/>, both named
/// <c>Foldwise</c>, with the span and instrument names operators filter on. Orleans' own meters are
/// <c>Microsoft.Orleans</c>.
/// </summary>
public static class FoldwiseTelemetry
{
    public const string Name = "Foldwise";
    public const string OrleansMeter = "Microsoft.Orleans";

    public const string SearchSpan = "foldwise.search";
    public const string TrialSpan = "foldwise.trial";
    public const string FoldSpan = "foldwise.fold";
    public const string BlendSpan = "foldwise.blend";

    /// <summary>Attribute names, namespaced as OpenTelemetry's naming conventions ask of a project's own attributes.</summary>
    public const string SearchTag = "foldwise.search";
    public const string FamilyTag = "foldwise.family";
    public const string OutcomeTag = "foldwise.outcome";

    public const string TrialsDone = "foldwise.trials.done";
    public const string TrialDuration = "foldwise.trial.duration";
    public const string BusySlots = "foldwise.slots.busy";
    public const string QueueLength = "foldwise.queue.length";
    public const string BestScore = "foldwise.score.best";

    /// <summary>Trial durations in seconds, from sub-second rungs to hour-long full-budget fits (common practice: roughly ×2–3 steps).</summary>
    public static readonly double[] DurationBuckets = [0.25, 0.5, 1, 2, 5, 10, 20, 30, 60, 120, 300, 600, 1200, 1800, 3600];

    public static readonly string? Version = typeof(FoldwiseTelemetry).Assembly.GetName().Version?.ToString();

    /// <summary>Spans are started on this one source; the meters are created per host (<see cref="FoldwiseMetrics"/>).</summary>
    public static readonly ActivitySource Source = new(Name, Version);
}
