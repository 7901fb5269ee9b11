using System.Collections.Immutable;

namespace Foldwise.Core.Spaces;

/// <summary>
/// One searchable parameter. For <see cref="ParameterKind.Choice"/> the value is an index into
/// <see cref="Choices"/> and Low/High are 0 and Choices.Length − 1. A fixed value has Low == High.
/// </summary>
public sealed record ParameterRange(string Name, ParameterKind Kind, double Low, double High, ImmutableArray<string> Choices)
{
    public static ParameterRange Integer(string name, int low, int high) => new(name, ParameterKind.Integer, low, high, []);

    public static ParameterRange Float(string name, double low, double high) => new(name, ParameterKind.Float, low, high, []);

    public static ParameterRange LogFloat(string name, double low, double high) => new(name, ParameterKind.LogFloat, low, high, []);

    public static ParameterRange Choice(string name, params string[] choices) => new(name, ParameterKind.Choice, 0, choices.Length - 1, [.. choices]);

    public static ParameterRange Fixed(string name, double value) => new(name, ParameterKind.Float, value, value, []);

    public bool IsFixed => Low == High;

    /// <summary>Whether a value lies in the range (integers and choices must be whole).</summary>
    public bool Contains(double value) =>
        double.IsFinite(value) && value >= Low && value <= High &&
        (Kind is not (ParameterKind.Integer or ParameterKind.Choice) || value == Math.Round(value));

    /// <summary>The value as a person reads it: a choice's name, a whole number, or a short real.</summary>
    public string Display(double value) => Kind switch
    {
        ParameterKind.Choice => Choices[(int)value],
        ParameterKind.Integer => ((long)value).ToString(),
        _ => value.ToString("G4"),
    };
}
