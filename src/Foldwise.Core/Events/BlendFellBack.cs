using System.Collections.Immutable;

namespace Foldwise.Core.Events;

/// <summary>No trial reached its family's full budget, so the blend pools each family's trials that went furthest.</summary>
/// <param name="Families">Each family with done trials, in the definition's order.</param>
public sealed record BlendFellBack(ImmutableArray<FamilyReach> Families) : SearchEvent;
