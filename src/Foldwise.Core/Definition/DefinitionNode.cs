using System.Collections.Immutable;
using System.Text.Json;

namespace Foldwise.Core.Definition;

/// <summary>
/// One JSON value of a definition file with where it stands and its path (e.g. <c>schedule.eta</c>),
/// so every check can name the key and point at the line and column. Numbers keep their text.
/// </summary>
internal sealed class DefinitionNode
{
    public required JsonValueKind Kind { get; init; }

    public required string Path { get; init; }

    public required TextPosition Position { get; init; }

    /// <summary>A string's value or a number's text; null for other kinds.</summary>
    public string? Text { get; init; }

    public ImmutableArray<DefinitionMember> Members { get; init; } = [];

    public ImmutableArray<DefinitionNode> Items { get; init; } = [];

    /// <summary>How the value reads in a message: <c>"abc"</c>, <c>2.5</c>, <c>an object</c>.</summary>
    public string Describe() => Kind switch
    {
        JsonValueKind.String => $"\"{Text}\"",
        JsonValueKind.Number => Text!,
        JsonValueKind.Object => "an object",
        JsonValueKind.Array => "a list",
        JsonValueKind.True => "true",
        JsonValueKind.False => "false",
        _ => "null",
    };
}
