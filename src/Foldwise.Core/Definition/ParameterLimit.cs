namespace Foldwise.Core.Definition;

/// <summary>
/// The values a parameter can take at all, whatever range a file asks for; a bound is either
/// inclusive or open. A range reaching past these would only fail later, on a worker. This table holds the names
/// several families share; a name only one family has keeps its limit in that family's descriptor.
/// </summary>
public sealed record ParameterLimit(double Min, bool MinOpen, double Max, bool MaxOpen, string Meaning)
{
    private static readonly Dictionary<string, ParameterLimit> ByName = new(StringComparer.Ordinal)
    {
        // learning_rate > 0 — LightGBM docs/Parameters.rst (from memory).
        ["learning_rate"] = new(0, true, double.MaxValue, false, "a shrinkage rate"),

        // 1 < num_leaves <= 131072 — LightGBM docs/Parameters.rst.
        ["leaves"] = new(2, false, 131072, false, "leaves per tree"),

        // A leaf holds at least one row.
        ["min_leaf_rows"] = new(1, false, double.MaxValue, false, "rows per leaf"),

        // Fractions of columns and rows: 0 < f <= 1 — LightGBM docs/Parameters.rst (from memory).
        ["feature_fraction"] = new(0, true, 1, false, "a fraction of columns"),
        ["row_fraction"] = new(0, true, 1, false, "a fraction of rows"),

        // lambda_l2 >= 0 — LightGBM docs/Parameters.rst (from memory).
        ["l2"] = new(0, false, double.MaxValue, false, "a penalty weight"),
    };

    /// <summary>The shared limit for a parameter name, or null when the name has none (<see cref="Spaces.FamilyDescriptor.LimitOf"/> adds a family's own).</summary>
    public static ParameterLimit? For(string name) => ByName.GetValueOrDefault(name);

    /// <summary>Why <paramref name="value"/> is not allowed, or null when it is.</summary>
    public string? Problem(double value)
    {
        if (MinOpen ? value <= Min : value < Min)
        {
            return $"must be {(MinOpen ? "above" : "at least")} {Min} ({Meaning})";
        }

        if (MaxOpen ? value >= Max : value > Max)
        {
            return $"must be {(MaxOpen ? "below" : "at most")} {Max} ({Meaning})";
        }

        return null;
    }
}
