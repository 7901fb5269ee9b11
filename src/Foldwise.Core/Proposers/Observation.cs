namespace Foldwise.Core.Proposers;

/// <summary>
/// One finished result of a family at one budget. <see cref="Values"/> follows the order of the family's
/// <see cref="Spaces.ParameterSpace.Ranges"/> (choices as their index); lower scores are better.
/// </summary>
public readonly record struct Observation(int TrialId, double[] Values, double Score);
