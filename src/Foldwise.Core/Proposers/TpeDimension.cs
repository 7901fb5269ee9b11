using Foldwise.Core.Spaces;

namespace Foldwise.Core.Proposers;

/// <summary>
/// How TPE models one non-fixed parameter: reals on [low, high], log-reals on [ln low, ln high], whole numbers as
/// reals on [low − ½, high + ½] rounded back (so the end values get a full unit of room), choices as categories.
/// </summary>
internal sealed class TpeDimension
{
    public TpeDimension(int index, ParameterRange range)
    {
        Index = index;
        Range = range;
        (Low, High) = range.Kind switch
        {
            ParameterKind.Log => (Math.Log(range.Low), Math.Log(range.High)),
            ParameterKind.Whole => (range.Low - 0.5, range.High + 0.5),
            _ => (range.Low, range.High),
        };
    }

    /// <summary>Position of the parameter in the space's ranges (and in an observation's values).</summary>
    public int Index { get; }

    public ParameterRange Range { get; }

    public bool IsChoice => Range.Kind == ParameterKind.OneOf;

    public int Choices => (int)Range.High + 1;

    public double Low { get; }

    public double High { get; }

    /// <summary>A parameter value in model coordinates.</summary>
    public double ToModel(double value) => Range.Kind == ParameterKind.Log ? Math.Log(Math.Max(value, Range.Low)) : value;

    /// <summary>A model coordinate snapped to a value the range contains.</summary>
    public double ToValue(double model) => Range.Kind switch
    {
        ParameterKind.Log => Math.Clamp(Math.Exp(model), Range.Low, Range.High),
        ParameterKind.Whole or ParameterKind.OneOf => Math.Clamp(Math.Round(model), Range.Low, Range.High),
        _ => Math.Clamp(model, Range.Low, Range.High),
    };
}
