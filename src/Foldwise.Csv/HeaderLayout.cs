using Foldwise.Core.Data;

namespace Foldwise.Csv;

/// <summary>Which field of a row is the id, which the target, and which fields are features (in file order; ignored columns are not).</summary>
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

    public static HeaderLayout From(string file, IReadOnlyList<string> names, string idColumn, string? targetColumn, bool targetRequired, TableRules rules)
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

        if (targetRequired)
        {
            // The training table's header is where the definition's column lists must match.
            foreach (var (key, listed) in new[] { ("data.categories", rules.Categories), ("data.ignore", rules.Ignored) })
            {
                foreach (string name in listed)
                {
                    if (!seen.TryGetValue(name, out int at))
                    {
                        throw new InputException(file, $"'{key}' names '{name}', which the header lacks", 1);
                    }

                    if (at == id || at == target)
                    {
                        throw new InputException(file, $"'{key}' names '{name}', which is the id or target column", 1, at + 1);
                    }
                }
            }
        }

        var ignored = rules.Ignored.ToHashSet(StringComparer.Ordinal);
        var ordinals = Enumerable.Range(0, names.Count).Where(i => i != id && i != target && !ignored.Contains(names[i])).ToArray();
        return new HeaderLayout(names.Count, id, target, ordinals, [.. ordinals.Select(i => names[i])]);
    }
}
