using System.Text.Json;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Reads one parameter's range: <c>{"whole": [lo, hi]}</c>, <c>{"linear": [lo, hi]}</c>, <c>{"log": [lo, hi]}</c>,
/// <c>{"one_of": ["a", "b"]}</c>, or a bare number for a fixed value. The family's default range decides
/// which of these fit: whole-number parameters take int, real ones float or log, named ones choice.
/// </summary>
internal sealed class RangeReader(DefinitionCheck check, FamilyDescriptor? family)
{
    public ParameterRange Read(DefinitionNode node, ParameterRange standard)
    {
        if (node.Kind == JsonValueKind.Number)
        {
            return Fixed(node, standard);
        }

        if (node.Kind != JsonValueKind.Object)
        {
            throw check.Fail(node, $"'{node.Path}' must be a number or a range such as {Example(standard.Kind)}, got {node.Describe()}");
        }

        var range = check.Object(node, DefinitionNames.RangeKeys, listing: "a range is one of");
        if (range.Count != 1)
        {
            throw check.Fail(node, $"'{node.Path}' must hold exactly one of {string.Join(", ", DefinitionNames.RangeKeys)}, such as {Example(standard.Kind)}");
        }

        var member = range.Members.Single();
        var kind = member.Key switch
        {
            "whole" => ParameterKind.Whole,
            "linear" => ParameterKind.Linear,
            "log" => ParameterKind.Log,
            _ => ParameterKind.OneOf,
        };

        if (!Fits(kind, standard.Kind))
        {
            throw check.Fail(member.KeyPosition, $"'{node.Path}' {Takes(standard.Kind)}, not '{member.Key}': write {Example(standard.Kind)}");
        }

        return kind == ParameterKind.OneOf ? OneOf(member.Value, standard) : Bounds(member.Value, standard.Name, kind);
    }

    private ParameterRange Fixed(DefinitionNode node, ParameterRange standard)
    {
        if (standard.Kind == ParameterKind.OneOf)
        {
            throw check.Fail(node, $"'{node.Path}' {Takes(standard.Kind)}: write {Example(standard.Kind)}");
        }

        double value = standard.Kind == ParameterKind.Whole ? check.Whole(node) : check.Number(node);
        WithinLimits(node, standard.Name, value);

        // A whole-number parameter stays whole when fixed, so workers still reject 31.5.
        return standard.Kind == ParameterKind.Whole
            ? ParameterRange.Whole(standard.Name, (int)value, (int)value)
            : ParameterRange.Fixed(standard.Name, value);
    }

    private ParameterRange Bounds(DefinitionNode node, string name, ParameterKind kind)
    {
        if (node.Kind != JsonValueKind.Array || node.Items.Length != 2)
        {
            throw check.Fail(node, $"'{node.Path}' must be a list of two numbers [lo, hi], got {Count(node)}");
        }

        var (loNode, hiNode) = (node.Items[0], node.Items[1]);
        double lo = kind == ParameterKind.Whole ? check.Whole(loNode) : check.Number(loNode);
        double hi = kind == ParameterKind.Whole ? check.Whole(hiNode) : check.Number(hiNode);
        if (lo > hi)
        {
            throw check.Fail(loNode, $"'{node.Path}' has lo {loNode.Text} above hi {hiNode.Text}");
        }

        if (kind == ParameterKind.Log && lo <= 0)
        {
            throw check.Fail(loNode, $"'{node.Path}' is sampled in log space, so lo must be above 0, got {loNode.Text}");
        }

        WithinLimits(loNode, name, lo);
        WithinLimits(hiNode, name, hi);
        return new ParameterRange(name, kind, lo, hi, []);
    }

    private ParameterRange OneOf(DefinitionNode node, ParameterRange standard)
    {
        if (node.Kind != JsonValueKind.Array || node.Items.Length == 0)
        {
            throw check.Fail(node, $"'{node.Path}' must be a non-empty list of names, got {Count(node)}");
        }

        var names = new List<string>();
        foreach (var item in node.Items)
        {
            string name = check.Text(item);
            if (!standard.Choices.Contains(name))
            {
                string? near = NearestName.Find(name, standard.Choices);
                string hint = near is null ? "" : $"; did you mean \"{near}\"?";
                throw check.Fail(item, $"'{item.Path}' cannot be \"{name}\"{hint} (valid: {string.Join(", ", standard.Choices)})");
            }

            if (names.Contains(name))
            {
                throw check.Fail(item, $"'{item.Path}' repeats \"{name}\"");
            }

            names.Add(name);
        }

        return new ParameterRange(standard.Name, ParameterKind.OneOf, 0, names.Count - 1, [.. names]);
    }

    private void WithinLimits(DefinitionNode node, string name, double value)
    {
        if ((family is null ? ParameterLimit.For(name) : family.LimitOf(name))?.Problem(value) is { } problem)
        {
            throw check.Fail(node, $"'{node.Path}' {problem}, got {node.Text}");
        }
    }

    private static bool Fits(ParameterKind given, ParameterKind standard) => standard switch
    {
        ParameterKind.Whole => given == ParameterKind.Whole,
        ParameterKind.OneOf => given == ParameterKind.OneOf,
        _ => given is ParameterKind.Linear or ParameterKind.Log,
    };

    private static string Takes(ParameterKind standard) => standard switch
    {
        ParameterKind.Whole => "takes whole numbers",
        ParameterKind.OneOf => "takes one of its named values",
        _ => "takes real numbers",
    };

    private static string Example(ParameterKind standard) => standard switch
    {
        ParameterKind.Whole => "{\"whole\": [lo, hi]}",
        ParameterKind.OneOf => "{\"one_of\": [\"a\", \"b\"]}",
        _ => "{\"linear\": [lo, hi]} or {\"log\": [lo, hi]}",
    };

    private static string Count(DefinitionNode node) =>
        node.Kind == JsonValueKind.Array ? $"a list of {node.Items.Length}" : node.Describe();
}
