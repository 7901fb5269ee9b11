namespace Foldwise.Core.Spaces;

/// <summary>
/// What a worker checks before it trains: every name belongs to the family, every value is within the
/// parameter's hard limits (a definition may widen the default ranges, never past these), whole numbers stay whole.
/// </summary>
public static class ParameterChecks
{
    public static IReadOnlyList<string> Problems(string family, ParameterSet parameters)
    {
        var descriptor = FamilyDescriptors.Get(family);
        var space = descriptor.Space;
        var problems = new List<string>();
        foreach (var (name, value) in parameters.Values)
        {
            var range = space.Find(name);
            if (range is null)
            {
                problems.Add($"unknown parameter '{name}' for {family}");
                continue;
            }

            if (!double.IsFinite(value))
            {
                problems.Add($"parameter '{name}' is {value}");
            }
            else if (range.Kind is ParameterKind.Whole or ParameterKind.OneOf && value != Math.Round(value))
            {
                problems.Add($"parameter '{name}' = {value} must be a whole number");
            }
            else if (descriptor.LimitOf(name)?.Problem(value) is { } problem)
            {
                problems.Add($"parameter '{name}' = {value} {problem}");
            }
        }

        problems.AddRange(space.Ranges.Where(r => !parameters.Values.ContainsKey(r.Name)).Select(r => $"parameter '{r.Name}' is missing"));
        return problems;
    }
}
