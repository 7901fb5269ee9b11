using System.Collections.Immutable;

namespace Foldwise.Core.Spaces;

/// <summary>
/// One searchable parameter. For <see cref="ParameterKind.OneOf"/> the value is an index into
/// <see cref="Choices"/> and Low/High are 0 and Choices.Length − 1. A fixed value has Low == High.
/// </summary>
public sealed record ParameterRange(string Name, ParameterKind Kind, double Low, double High, ImmutableArray<string> Choices)
{
    public static ParameterRange Whole(string name, int low, int high) => new(name, ParameterKind.Whole, low, high, []);

    public static ParameterRange Linear(string name, double low, double high) => new(name, ParameterKind.Linear, low, high, []);

    public static ParameterRange Log(string name, double low, double high) => new(name, ParameterKind.Log, low, high, []);

    public static ParameterRange OneOf(string name, params string[] choices) => new(name, ParameterKind.OneOf, 0, choices.Length - 1, [.. choices]);

    public static ParameterRange Fixed(string name, double value) => new(name, ParameterKind.Linear, value, value, []);

    public bool IsFixed => Low == High;

    /// <summary>Whether a value lies in the range (integers and choices must be whole).</summary>
    public bool Contains(double value) =>
        double.IsFinite(value) && value >= Low && value <= High &&
        (Kind is not (ParameterKind.Whole or ParameterKind.OneOf) || value == Math.Round(value));

    /// <summary>The value as a person reads it: a choice's name, a whole number, or a short real.</summary>
    public string Display(double value) => Kind switch
    {
        ParameterKind.OneOf => Choices[(int)value],
        ParameterKind.Whole => ((long)value).ToString(),
        _ => value.ToString("G4"),
    };
}
