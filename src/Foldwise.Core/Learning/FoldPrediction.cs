namespace Foldwise.Core.Learning;

/// <summary>A fold model's predictions on the fitting scale: held-out rows in the job's order, then every test row.</summary>
public sealed record FoldPrediction(double[] Validation, double[] Test);
