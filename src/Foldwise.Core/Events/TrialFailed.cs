using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>A trial failed for good (its reason is <see cref="TrialRecord.FailureReason"/>); <paramref name="Progress"/> is the search right after it.</summary>
public sealed record TrialFailed(string SearchId, TrialRecord Trial, SearchProgress Progress) : SearchEvent;
