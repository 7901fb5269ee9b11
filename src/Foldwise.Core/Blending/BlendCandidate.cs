namespace Foldwise.Core.Blending;

/// <summary>A pool member as the blend sees it: its out-of-fold predictions for every training row, on the fitting scale.</summary>
public sealed record BlendCandidate(int TrialId, string Family, double[] OutOfFold);
