using System.Collections.Immutable;

namespace Foldwise.Core.Spaces;

/// <summary>
/// A candidate's parameter values by name. Choices are held as their index; see
/// <see cref="ParameterRange.Display"/> for the readable form.
/// </summary>
public sealed record ParameterSet(ImmutableSortedDictionary<string, double> Values)
{
    public static ParameterSet Empty { get; } = new(ImmutableSortedDictionary<string, double>.Empty);

    public double this[string name] => Values[name];

    public double Get(string name, double fallback) => Values.TryGetValue(name, out double v) ? v : fallback;

    public static ParameterSet Of(IEnumerable<KeyValuePair<string, double>> values) => new(values.ToImmutableSortedDictionary());

    public bool Equals(ParameterSet? other) =>
        other is not null && Values.Count == other.Values.Count &&
        Values.All(kv => other.Values.TryGetValue(kv.Key, out double v) && v.Equals(kv.Value));

    public override int GetHashCode()
    {
        var hash = default(HashCode);
        foreach (var (k, v) in Values)
        {
            hash.Add(k);
            hash.Add(v);
        }

        return hash.ToHashCode();
    }

    /// <summary>Compact text, e.g. <c>leaves=31 learning_rate=0.05</c>.</summary>
    public string Describe(ParameterSpace? space = null) => string.Join(' ', Values.Select(kv =>
        $"{kv.Key}={space?.Find(kv.Key)?.Display(kv.Value) ?? kv.Value.ToString("G4")}"));

    public override string ToString() => Describe();
}
