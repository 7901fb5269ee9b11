using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Reads <c>families</c>: each key a built-in family, each value an object naming only the parameters
/// it changes; every other parameter keeps the family's default range, in the default order.
/// </summary>
internal sealed class FamiliesReader(DefinitionCheck check, IReadOnlyList<FamilySearch> builtIn)
{
    public ImmutableArray<FamilySearch> Read(DefinitionNode node)
    {
        string[] known = [.. builtIn.Select(f => f.Family)];
        var families = check.Object(node, known, "family", "built-in families");
        if (families.Count == 0)
        {
            throw check.Fail(node, $"'families' names no family; add one or more of {string.Join(", ", known)}");
        }

        return [.. families.Members.Select(m => new FamilySearch(m.Key, Space(m.Value, builtIn.First(f => f.Family == m.Key).Space)))];
    }

    private ParameterSpace Space(DefinitionNode node, ParameterSpace standard)
    {
        string family = node.Path["families.".Length..];
        var names = standard.Ranges.Select(r => r.Name).ToArray();
        var given = check.Object(node, names, "parameter", $"{family}'s parameters");
        var ranges = new RangeReader(check, FamilyDescriptors.Find(family));
        return new ParameterSpace([.. standard.Ranges.Select(r => given.Get(r.Name) is { } m ? ranges.Read(m.Value, r) : r)]);
    }
}
