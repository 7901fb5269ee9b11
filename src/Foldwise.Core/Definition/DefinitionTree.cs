using System.Collections.Immutable;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using Foldwise.Core.Data;

namespace Foldwise.Core.Definition;

/// <summary>
/// Reads JSON text into <see cref="DefinitionNode"/>s with System.Text.Json's forward-only reader, which
/// (unlike JsonDocument) tells where each token starts. Comments and trailing commas are allowed.
/// </summary>
internal static partial class DefinitionTree
{
    private static readonly JsonReaderOptions Options = new()
    {
        CommentHandling = JsonCommentHandling.Skip,
        AllowTrailingCommas = true,
    };

    /// <summary>The root value; malformed JSON becomes an <see cref="InputException"/> at the reader's line and column.</summary>
    public static DefinitionNode Parse(ReadOnlySpan<byte> utf8, string file)
    {
        var map = new LineMap(utf8);
        var reader = new Utf8JsonReader(utf8, Options);
        bool started = false;
        try
        {
            // With the final block at hand the reader throws, rather than returns false, on text without a token.
            started = reader.Read();
            var root = ReadValue(ref reader, map, "");

            // Anything after the root value makes the reader throw, which lands below.
            reader.Read();
            return root;
        }
        catch (JsonException) when (!started && IsBlank(utf8))
        {
            throw new InputException(file, "the file is empty; a definition is one JSON object { ... }", 1, 1);
        }
        catch (JsonException e)
        {
            var at = map.At(e.LineNumber ?? 0, e.BytePositionInLine ?? 0);
            throw new InputException(file, $"malformed JSON: {Clean(e.Message)}", at.Line, at.Column);
        }
    }

    private static bool IsBlank(ReadOnlySpan<byte> utf8) => utf8.Trim(" \t\r\n"u8).IsEmpty;

    private static DefinitionNode ReadValue(ref Utf8JsonReader reader, LineMap map, string path)
    {
        var at = map.At(reader.TokenStartIndex);
        switch (reader.TokenType)
        {
            case JsonTokenType.StartObject:
                return ReadObject(ref reader, map, path, at);
            case JsonTokenType.StartArray:
                var items = ImmutableArray.CreateBuilder<DefinitionNode>();
                while (reader.Read() && reader.TokenType != JsonTokenType.EndArray)
                {
                    items.Add(ReadValue(ref reader, map, $"{path}[{items.Count}]"));
                }

                return new DefinitionNode { Kind = JsonValueKind.Array, Path = path, Position = at, Items = items.ToImmutable() };
            case JsonTokenType.String:
                return new DefinitionNode { Kind = JsonValueKind.String, Path = path, Position = at, Text = reader.GetString() };
            case JsonTokenType.Number:
                return new DefinitionNode { Kind = JsonValueKind.Number, Path = path, Position = at, Text = Encoding.UTF8.GetString(reader.ValueSpan) };
            case JsonTokenType.True:
                return new DefinitionNode { Kind = JsonValueKind.True, Path = path, Position = at };
            case JsonTokenType.False:
                return new DefinitionNode { Kind = JsonValueKind.False, Path = path, Position = at };
            default:
                return new DefinitionNode { Kind = JsonValueKind.Null, Path = path, Position = at };
        }
    }

    private static DefinitionNode ReadObject(ref Utf8JsonReader reader, LineMap map, string path, TextPosition at)
    {
        var members = ImmutableArray.CreateBuilder<DefinitionMember>();
        while (reader.Read() && reader.TokenType == JsonTokenType.PropertyName)
        {
            var keyAt = map.At(reader.TokenStartIndex);
            string key = reader.GetString()!;
            reader.Read();
            var value = ReadValue(ref reader, map, path.Length == 0 ? key : $"{path}.{key}");
            members.Add(new DefinitionMember(key, keyAt, value));
        }

        return new DefinitionNode { Kind = JsonValueKind.Object, Path = path, Position = at, Members = members.ToImmutable() };
    }

    // The reader appends its own 0-based position; the InputException carries the 1-based one instead.
    private static string Clean(string message) => PositionSuffix().Replace(message, "").Trim();

    [GeneratedRegex(@"\s*LineNumber: \d+ \| BytePositionInLine: \d+\.?\s*$")]
    private static partial Regex PositionSuffix();
}
