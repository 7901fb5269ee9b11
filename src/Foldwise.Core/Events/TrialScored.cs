using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>The coordinator committed a trial's result; <paramref name="Progress"/> is the search right after it.</summary>
public sealed record TrialScored(string SearchId, TrialRecord Trial, SearchProgress Progress) : SearchEvent;
