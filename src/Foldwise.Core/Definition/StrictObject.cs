namespace Foldwise.Core.Definition;

/// <summary>
/// A JSON object whose keys have all been checked against the ones its place allows; a retired key that was
/// accepted is held under the name that replaced it.
/// </summary>
internal sealed class StrictObject(DefinitionNode node, IReadOnlyDictionary<string, DefinitionMember> members, IReadOnlyList<DefinitionMember> ordered)
{
    public DefinitionNode Node => node;

    public int Count => members.Count;

    /// <summary>The members in file order, under their current names.</summary>
    public IEnumerable<DefinitionMember> Members => ordered;

    public DefinitionMember? Get(string key) => members.GetValueOrDefault(key);
}
