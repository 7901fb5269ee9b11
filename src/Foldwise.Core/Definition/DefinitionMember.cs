namespace Foldwise.Core.Definition;

/// <summary>One key of a JSON object and its value; the value's path is the key's path.</summary>
internal sealed record DefinitionMember(string Key, TextPosition KeyPosition, DefinitionNode Value)
{
    public string Path => Value.Path;
}
