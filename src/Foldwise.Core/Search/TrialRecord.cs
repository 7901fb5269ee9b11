using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Search;

/// <summary>
/// Everything the store keeps about one trial (its prediction vectors are kept beside it).
/// Ids count up from 1 within a search and are never reused.
/// </summary>
public sealed record TrialRecord
{
    public required int Id { get; init; }

    public required string Family { get; init; }

    public required ParameterSet Parameters { get; init; }

    /// <summary>Boosting rounds (or trees) this trial trains.</summary>
    public required int Budget { get; init; }

    public int Rung { get; init; }

    /// <summary>
    /// 0: the trial trains every fold of the plan (always, but under a schedule that screens on folds). n: only the
    /// plan's first n folds, and <see cref="Score"/> covers their held-out rows alone: a screening score, comparable
    /// with other trials on the same folds but not with a whole trial's, and never pooled into a blend.
    /// </summary>
    public int Folds { get; init; }

    /// <summary>True when the trial trains every fold: its score and out-of-fold vector cover every row.</summary>
    public bool AllFolds => Folds == 0;

    public int? ParentId { get; init; }

    public required string Proposer { get; init; }

    public int Bracket { get; init; }

    public TrialState State { get; init; } = TrialState.Queued;

    /// <summary>How many leases this trial has been given; a late report from an older attempt is ignored.</summary>
    public int Attempt { get; init; }

    public string? Worker { get; init; }

    public string? Slot { get; init; }

    public DateTimeOffset? LeaseExpires { get; init; }

    public required DateTimeOffset Created { get; init; }

    public DateTimeOffset? Started { get; init; }

    public DateTimeOffset? Finished { get; init; }

    /// <summary>Score of the pooled out-of-fold predictions on the fitting scale; set when done.</summary>
    public double? Score { get; init; }

    public ImmutableArray<double> FoldScores { get; init; } = [];

    /// <summary>
    /// The round count the trial kept (its best pooled held-out score, at most <see cref="Budget"/>) and predicted with,
    /// when it trained round by round; null when it used its whole budget, and in stores written before rounds were kept.
    /// </summary>
    public int? BestRound { get; init; }

    /// <summary>
    /// Rounds of fold models the trial took over from its screen instead of training them again (summed over folds;
    /// 0 when it trained every round, and in stores written before promotions continued their screens).
    /// </summary>
    public int RoundsContinued { get; init; }

    public string? FailureReason { get; init; }

    /// <summary>Attempts lost to an expired lease or a worker error; at the coordinator's limit the trial fails. Interruptions (a stop, a restart) do not count.</summary>
    public int Failures { get; init; }

    /// <summary>Attempts that ended without a result (lease lost, worker error), oldest first, e.g. "1: lease expired on w2/0".</summary>
    public ImmutableArray<string> LostAttempts { get; init; } = [];

    public TimeSpan? Duration => Started is { } s && Finished is { } f ? f - s : null;
}
