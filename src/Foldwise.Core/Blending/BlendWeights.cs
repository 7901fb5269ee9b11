namespace Foldwise.Core.Blending;

/// <summary>
/// Solved blend weights, one per column in the order given, and the objective ‖y − P w‖²
/// (a sum of squares, not a mean) computed directly from the residual.
/// </summary>
public sealed record BlendWeights(double[] Weights, double Objective);
