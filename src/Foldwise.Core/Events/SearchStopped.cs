using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>The search creates no more trials and none is running; <paramref name="Progress"/> says why and where it ended.</summary>
public sealed record SearchStopped(string SearchId, SearchProgress Progress) : SearchEvent;
