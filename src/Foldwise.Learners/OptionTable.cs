using Foldwise.Core.Spaces;

namespace Foldwise.Learners;

/// <summary>
/// A family's one mapping from the project's parameter names to its library's options. Every name of
/// the family's default space has exactly one entry (a test pins that), so nothing is silently ignored.
/// </summary>
internal sealed class OptionTable<TOptions>(IReadOnlyDictionary<string, Action<TOptions, double>> entries)
{
    public IEnumerable<string> Names => entries.Keys;

    public void Apply(ParameterSet parameters, TOptions options)
    {
        foreach (var (name, value) in parameters.Values)
        {
            entries[name](options, value);
        }
    }
}
