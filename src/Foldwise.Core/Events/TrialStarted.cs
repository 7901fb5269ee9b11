using Foldwise.Core.Search;

namespace Foldwise.Core.Events;

/// <summary>The coordinator leased a trial to a slot (<see cref="TrialRecord.Worker"/>, <see cref="TrialRecord.Slot"/>).</summary>
public sealed record TrialStarted(string SearchId, TrialRecord Trial) : SearchEvent;
