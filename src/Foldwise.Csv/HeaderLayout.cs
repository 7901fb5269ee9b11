using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>Which field of a row is the id, which the target, and which fields are features (in file order).</summary>
internal sealed class HeaderLayout
{
    private HeaderLayout(int fieldCount, int idOrdinal, int targetOrdinal, int[] featureOrdinals, string[] featureNames)
    {
        FieldCount = fieldCount;
        IdOrdinal = idOrdinal;
        TargetOrdinal = targetOrdinal;
        FeatureOrdinals = featureOrdinals;
        FeatureNames = featureNames;
    }

    public int FieldCount { get; }

    public int IdOrdinal { get; }

    /// <summary>The target's field, or -1 when the header has none.</summary>
    public int TargetOrdinal { get; }

    public int[] FeatureOrdinals { get; }

    public string[] FeatureNames { get; }

    public static HeaderLayout From(string file, IReadOnlyList<string> names, string idColumn, string? targetColumn, bool targetRequired)
    {
        var seen = new Dictionary<string, int>(names.Count, StringComparer.Ordinal);
        for (int i = 0; i < names.Count; i++)
        {
            if (string.IsNullOrWhiteSpace(names[i]))
            {
                throw new InputException(file, $"header column {i + 1} has no name", 1, i + 1);
            }

            if (!seen.TryAdd(names[i], i))
            {
                throw new InputException(
                    file, $"column name '{names[i]}' appears twice in the header, as columns {seen[names[i]] + 1} and {i + 1}", 1, i + 1);
            }
        }

        if (!seen.TryGetValue(idColumn, out int id))
        {
            throw new InputException(file, $"the header has no id column '{idColumn}'", 1);
        }

        int target = -1;
        if (targetColumn is not null && !seen.TryGetValue(targetColumn, out target))
        {
            if (targetRequired)
            {
                throw new InputException(file, $"the header has no target column '{targetColumn}'", 1);
            }

            target = -1;
        }

        var ordinals = Enumerable.Range(0, names.Count).Where(i => i != id && i != target).ToArray();
        return new HeaderLayout(names.Count, id, target, ordinals, [.. ordinals.Select(i => names[i])]);
    }
}
