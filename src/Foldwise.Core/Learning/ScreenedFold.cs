namespace Foldwise.Core.Learning;

/// <summary>One fold of a screened trial as <see cref="ScreenedFits"/> keeps it: the model, the job it was fitted for, and its held-out predictions after each round it trained (index 0 = after round 1).</summary>
public sealed record ScreenedFold(IRoundFit Fit, FoldJob Job, IReadOnlyList<double[]> HeldOutByRound);
