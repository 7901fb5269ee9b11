using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>A candidate moved up a rung: <paramref name="Trial"/> trains it again at the higher budget (its parent is the trial below).</summary>
public sealed record CandidatePromoted(string SearchId, TrialRecord Trial) : SearchEvent;
