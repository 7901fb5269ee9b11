namespace Foldwise.Core.Learning;

/// <summary>One fold's predictions and the model that made them, as bytes its family can load again.</summary>
public sealed record KeptFold(FoldPrediction Prediction, byte[] Model);
