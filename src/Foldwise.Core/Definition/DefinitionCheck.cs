using System.Globalization;
using System.Text.Json;
using Foldwise.Core.Data;

namespace Foldwise.Core.Definition;

/// <summary>
/// The strict checks every part of a definition shares: known keys only, the right JSON type, whole
/// numbers, bounds. Each failure is an <see cref="InputException"/> naming the key's path and position.
/// A retired name (<see cref="RetiredNames"/>) is refused with its replacement suggested, unless
/// <paramref name="acceptRetired"/> is set (reading a definition a store kept from an earlier version),
/// when it is read as its replacement.
/// </summary>
internal sealed class DefinitionCheck(string file, bool acceptRetired = false)
{
    /// <summary>True when reading the definition a store kept (which may come from an earlier version).</summary>
    public bool ReadsStoredText => acceptRetired;

    public InputException Fail(TextPosition at, string problem) => new(file, problem, at.Line, at.Column);

    public InputException Fail(DefinitionNode node, string problem) => Fail(node.Position, problem);

    /// <summary>How a node is named in a message: its quoted path, or "the definition" at the root.</summary>
    public static string Label(DefinitionNode node) => node.Path.Length == 0 ? "the definition" : $"'{node.Path}'";

    /// <summary>
    /// Opens an object whose keys must come from <paramref name="known"/>; an unknown or repeated key is an
    /// error at that key, suggesting the nearest known one. <paramref name="noun"/> names what a key is
    /// ("key", "family", "parameter") and <paramref name="listing"/> introduces the list of valid ones.
    /// </summary>
    public StrictObject Object(DefinitionNode node, IReadOnlyList<string> known, string noun = "key", string listing = "known keys here")
    {
        if (node.Kind != JsonValueKind.Object)
        {
            throw Fail(node, $"{Label(node)} must be an object {{ ... }}, got {node.Describe()}");
        }

        var members = new Dictionary<string, DefinitionMember>(StringComparer.Ordinal);
        var ordered = new List<DefinitionMember>();
        foreach (var given in node.Members)
        {
            var member = given;
            if (!known.Contains(member.Key))
            {
                string? renamed = RetiredNames.ReplacementOf(member.Key) is { } r && known.Contains(r) ? r : null;
                if (renamed is not null && acceptRetired)
                {
                    member = member with { Key = renamed };
                }
                else
                {
                    string? near = renamed ?? NearestName.Find(member.Key, known);
                    string retired = renamed is null ? "" : " (a retired name)";
                    string hint = near is null ? "" : $"; did you mean '{near}'?";
                    throw Fail(member.KeyPosition, $"unknown {noun} '{member.Path}'{retired}{hint} ({listing}: {string.Join(", ", known)})");
                }
            }

            if (!members.TryAdd(member.Key, member))
            {
                throw Fail(member.KeyPosition, $"'{member.Path}' is given twice");
            }

            ordered.Add(member);
        }

        return new StrictObject(node, members, ordered);
    }

    public DefinitionMember Require(StrictObject obj, string key) =>
        obj.Get(key) ?? throw Fail(obj.Node, $"{Label(obj.Node)} needs the key '{key}'");

    public string Text(DefinitionNode node)
    {
        if (node.Kind != JsonValueKind.String || string.IsNullOrWhiteSpace(node.Text))
        {
            throw Fail(node, $"{Label(node)} must be a non-empty string, got {node.Describe()}");
        }

        return node.Text;
    }

    public double Number(DefinitionNode node)
    {
        if (node.Kind != JsonValueKind.Number)
        {
            throw Fail(node, $"{Label(node)} must be a number, got {node.Describe()}");
        }

        double value = double.Parse(node.Text!, NumberStyles.Float, CultureInfo.InvariantCulture);
        return double.IsFinite(value) ? value : throw Fail(node, $"{Label(node)} is too large, got {node.Text}");
    }

    public int Whole(DefinitionNode node)
    {
        double value = Number(node);
        if (value != Math.Round(value))
        {
            throw Fail(node, $"{Label(node)} must be a whole number, got {node.Text}");
        }

        return value is >= int.MinValue and <= int.MaxValue
            ? (int)value
            : throw Fail(node, $"{Label(node)} is out of range, got {node.Text}");
    }

    /// <summary>A whole number of at least <paramref name="min"/>; <paramref name="why"/> ends the message.</summary>
    public int Whole(DefinitionNode node, int min, string why = "")
    {
        int value = Whole(node);
        return value >= min ? value : throw Fail(node, $"{Label(node)} must be at least {min}{why}, got {value}");
    }

    public T Word<T>(DefinitionNode node, NameTable<T> table)
        where T : struct, Enum
    {
        string valid = string.Join(", ", table.Names);
        if (node.Kind != JsonValueKind.String)
        {
            throw Fail(node, $"{Label(node)} must be one of {valid}, got {node.Describe()}");
        }

        if (table.TryParse(node.Text!, out T value))
        {
            return value;
        }

        string? renamed = RetiredNames.ReplacementOf(node.Text!) is { } r && table.Names.Contains(r) ? r : null;
        if (renamed is not null && acceptRetired && table.TryParse(renamed, out value))
        {
            return value;
        }

        string? near = renamed ?? NearestName.Find(node.Text!, table.Names);
        string retired = renamed is null ? "" : " (a retired name)";
        string hint = near is null ? "" : $"; did you mean \"{near}\"?";
        throw Fail(node, $"{Label(node)} cannot be \"{node.Text}\"{retired}{hint} (valid: {valid})");
    }
}
