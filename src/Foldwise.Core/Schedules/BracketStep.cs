using Foldwise.Core.Spaces;

namespace Foldwise.Core.Schedules;

/// <summary>A step of a <see cref="BracketRun"/>; Parent and Parameters are set for promotions.</summary>
internal readonly record struct BracketStep(BracketStepKind Kind, int Rung, int Budget, int Parent = 0, ParameterSet? Parameters = null);
