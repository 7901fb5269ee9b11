using System.Collections.Immutable;

namespace Foldwise.Core.Spaces;

/// <summary>The parameters searched for one family, in a fixed order.</summary>
public sealed record ParameterSpace(ImmutableArray<ParameterRange> Ranges)
{
    public ParameterRange? Find(string name) => Ranges.FirstOrDefault(r => r.Name == name);

    /// <summary>
    /// Problems with a parameter set against this space: unknown names, missing names, values out of range.
    /// Empty when it is valid. Workers check every set before training.
    /// </summary>
    public IReadOnlyList<string> Problems(ParameterSet parameters)
    {
        var problems = new List<string>();
        foreach (var (name, value) in parameters.Values)
        {
            var range = Find(name);
            if (range is null)
            {
                problems.Add($"unknown parameter '{name}'");
            }
            else if (!range.Contains(value))
            {
                problems.Add($"parameter '{name}' = {value} is outside [{range.Low}, {range.High}]");
            }
        }

        problems.AddRange(Ranges.Where(r => !parameters.Values.ContainsKey(r.Name)).Select(r => $"parameter '{r.Name}' is missing"));
        return problems;
    }
}
