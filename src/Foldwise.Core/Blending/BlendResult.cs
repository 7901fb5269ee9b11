namespace Foldwise.Core.Blending;

/// <summary>
/// The blend stage's answer: the summary to store, the weights aligned to the pool, the weights each
/// fold's nested fit chose (fitted without that fold), and the blended and nested out-of-fold predictions
/// (fitting scale, not clamped).
/// </summary>
public sealed record BlendResult(
    BlendSummary Summary,
    double[] Weights,
    IReadOnlyList<double[]> NestedWeights,
    double[] OutOfFold,
    double[] NestedOutOfFold);
