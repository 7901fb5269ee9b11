namespace Foldwise.Core.Definition;

/// <summary>A JSON object whose keys have all been checked against the ones its place allows.</summary>
internal sealed class StrictObject(DefinitionNode node, IReadOnlyDictionary<string, DefinitionMember> members)
{
    public DefinitionNode Node => node;

    public int Count => members.Count;

    public IEnumerable<DefinitionMember> Members => node.Members;

    public DefinitionMember? Get(string key) => members.GetValueOrDefault(key);
}
