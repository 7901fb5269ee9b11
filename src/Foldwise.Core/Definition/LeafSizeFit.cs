using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Narrows every family's <c>min_leaf_rows</c> range to what the folds' training rows allow. A tree splits only when
/// each side keeps that many rows, so on a small table candidates drawn above half a fold's rows fit no tree at all
/// and every trial fails. The cap is a quarter of the smallest fold's training rows, so a tree can still split twice
/// (own rule); ranges already under it are left as they are.
/// </summary>
public static class LeafSizeFit
{
    public const string Parameter = "min_leaf_rows";

    public static int Cap(int foldTrainingRows) => Math.Max(1, foldTrainingRows / 4);

    /// <summary>The space with its <c>min_leaf_rows</c> range narrowed to folds of <paramref name="foldTrainingRows"/> rows.</summary>
    public static ParameterSpace ToRows(ParameterSpace space, int foldTrainingRows) =>
        space.Find(Parameter) is { } range && range.High > Cap(foldTrainingRows)
            ? new ParameterSpace([.. space.Ranges.Select(r => r.Name == Parameter ? Narrow(r, Cap(foldTrainingRows)) : r)])
            : space;

    /// <summary>The definition with its ranges narrowed, and one line per family whose range changed.</summary>
    public static (SearchDefinition Definition, ImmutableArray<string> Changes) ToFolds(SearchDefinition definition, int smallestFoldTrainingRows)
    {
        int cap = Cap(smallestFoldTrainingRows);
        var changes = ImmutableArray.CreateBuilder<string>();
        var families = definition.Families.Select(family =>
        {
            if (family.Space.Find(Parameter) is not { } range || range.High <= cap)
            {
                return family;
            }

            var narrowed = Narrow(range, cap);
            changes.Add($"{family.Family} {Parameter} {range.Display(range.Low)}–{range.Display(range.High)} narrowed to " +
                        $"{narrowed.Display(narrowed.Low)}–{narrowed.Display(narrowed.High)}: the smallest fold trains on {smallestFoldTrainingRows} rows");
            return family with { Space = ToRows(family.Space, smallestFoldTrainingRows) };
        });
        var fitted = definition with { Families = [.. families] };
        return (changes.Count == 0 ? definition : fitted, changes.ToImmutable());
    }

    private static ParameterRange Narrow(ParameterRange range, int cap) => range with { Low = Math.Min(range.Low, cap), High = cap };
}
