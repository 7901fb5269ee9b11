namespace Foldwise.Core.Definition;

/// <summary>When a search stops: after this many trials, after this many hours of wall clock, whichever comes first. At least one is set.</summary>
public sealed record SearchBudget(int? Trials, double? Hours);
