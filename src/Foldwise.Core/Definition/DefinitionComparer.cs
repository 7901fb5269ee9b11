using System.Collections.Immutable;
using Foldwise.Core.Spaces;

namespace Foldwise.Core.Definition;

/// <summary>
/// Compares definitions by content. Records alone compare their <see cref="ImmutableArray{T}"/> members
/// (families, ranges, choices) by reference, so two reads of the same file would differ without this.
/// </summary>
public sealed class DefinitionComparer : IEqualityComparer<SearchDefinition>
{
    public static DefinitionComparer Instance { get; } = new();

    public bool Equals(SearchDefinition? x, SearchDefinition? y) =>
        ReferenceEquals(x, y) || (x is not null && y is not null &&
        x.Name == y.Name && x.Data == y.Data && x.Metric == y.Metric && x.Folds == y.Folds && x.Seed == y.Seed &&
        x.Screening == y.Screening && x.Schedule == y.Schedule && x.Budget == y.Budget && x.Blend == y.Blend &&
        Same(x.Families, y.Families, (a, b) => a.Family == b.Family && SameSpace(a.Space, b.Space) && a.BudgetUnder(x.Schedule) == b.BudgetUnder(y.Schedule) &&
                                                  a.FewLevelsForm == b.FewLevelsForm));

    public int GetHashCode(SearchDefinition obj) =>
        HashCode.Combine(obj.Name, obj.Data, obj.Folds, obj.Seed, obj.Schedule, obj.Budget, obj.Families.Length);

    /// <summary>Whether two spaces hold the same ranges in the same order.</summary>
    public static bool SameSpace(ParameterSpace a, ParameterSpace b) => Same(a.Ranges, b.Ranges, SameRange);

    private static bool SameRange(ParameterRange a, ParameterRange b) =>
        a.Name == b.Name && a.Kind == b.Kind && a.Low.Equals(b.Low) && a.High.Equals(b.High) &&
        Same(a.Choices, b.Choices, (p, q) => p == q);

    private static bool Same<T>(ImmutableArray<T> a, ImmutableArray<T> b, Func<T, T, bool> equal)
    {
        // A default (never set) array counts as empty.
        var left = a.IsDefault ? [] : a;
        var right = b.IsDefault ? [] : b;
        if (left.Length != right.Length)
        {
            return false;
        }

        for (int i = 0; i < left.Length; i++)
        {
            if (!equal(left[i], right[i]))
            {
                return false;
            }
        }

        return true;
    }
}
