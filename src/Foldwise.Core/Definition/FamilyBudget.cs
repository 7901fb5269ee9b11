namespace Foldwise.Core.Definition;

/// <summary>
/// One family's rungs in its own budget unit (<see cref="Spaces.FamilyDescriptor.Unit"/>): the first rung and the full
/// budget a candidate is scored at when it reaches the top.
/// </summary>
public sealed record FamilyBudget(int FirstRung, int FullBudget);
