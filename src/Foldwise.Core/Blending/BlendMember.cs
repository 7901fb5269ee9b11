namespace Foldwise.Core.Blending;

/// <summary>One pool member of a blend and its weight (0 for a member the solver left out).</summary>
public sealed record BlendMember(int TrialId, string Family, double Weight);
