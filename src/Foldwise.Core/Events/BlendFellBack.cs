namespace Foldwise.Core.Events;

/// <summary>No trial reached the full budget, so the blend pools the trials that went furthest.</summary>
public sealed record BlendFellBack(int FullBudget, int Furthest) : SearchEvent;
