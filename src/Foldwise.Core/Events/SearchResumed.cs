namespace Foldwise.Core.Events;

/// <summary>A stored search continues: trials done before, trials to run again, time spent in earlier sessions.</summary>
public sealed record SearchResumed(string SearchId, int Done, int ToRunAgain, TimeSpan SpentBefore) : SearchEvent;
