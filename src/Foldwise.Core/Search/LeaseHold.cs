namespace Foldwise.Core.Search;

/// <summary>One live lease of a running trial: which attempt, where it runs, since when, until when unless renewed.</summary>
public sealed record LeaseHold(int Attempt, string Worker, string Slot, DateTimeOffset Started, DateTimeOffset Expires);
