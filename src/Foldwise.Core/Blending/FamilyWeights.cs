namespace Foldwise.Core.Blending;

/// <summary>Which families carry the blend's weight: each family's summed member weights.</summary>
public static class FamilyWeights
{
    /// <summary>
    /// Every family of <paramref name="families"/> (a search's, in its order) with its members' summed weight, then any
    /// member family the list does not name; heaviest first, ties in the given order.
    /// </summary>
    public static IReadOnlyList<(string Family, double Weight)> Of(BlendSummary blend, IEnumerable<string> families)
    {
        ArgumentNullException.ThrowIfNull(blend);
        ArgumentNullException.ThrowIfNull(families);
        var order = families.Concat(blend.Members.Select(m => m.Family)).Distinct(StringComparer.Ordinal).ToList();
        return
        [
            .. order.Select((f, i) => (Family: f, Weight: blend.Members.Where(m => m.Family == f).Sum(m => m.Weight), Index: i))
                .OrderByDescending(x => x.Weight).ThenBy(x => x.Index)
                .Select(x => (x.Family, x.Weight)),
        ];
    }
}
