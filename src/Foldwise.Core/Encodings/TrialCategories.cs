using System.Collections.Immutable;
using Foldwise.Core.Data;

namespace Foldwise.Core.Encodings;

/// <summary>Codes a training and an aligned test table's category columns against the training levels.</summary>
public static class TrialCategories
{
    public static ImmutableArray<TrialCategory> From(FeatureTable train, FeatureTable test, EncodingOptions options)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(test);
        var categories = ImmutableArray.CreateBuilder<TrialCategory>(train.CategoryNames.Length);
        for (int c = 0; c < train.CategoryNames.Length; c++)
        {
            var column = train.Categories[c];
            categories.Add(new TrialCategory(
                train.CategoryNames[c], column.Levels.Length, [.. column.Codes], TestCodes(column, test.Categories[c]), EncodingChoice.For(column, options)));
        }

        return categories.MoveToImmutable();
    }

    /// <summary>Levels of <paramref name="test"/> that <paramref name="train"/> lacks, and the rows holding them.</summary>
    public static (int Levels, int Rows) NewLevels(CategoryColumn train, CategoryColumn test)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(test);
        var known = train.Levels.ToHashSet(StringComparer.Ordinal);
        var unseen = test.Levels.Select(l => !known.Contains(l)).ToArray();
        var used = new bool[unseen.Length];
        int rows = 0;
        foreach (int code in test.Codes)
        {
            if (code >= 0 && unseen[code])
            {
                rows++;
                used[code] = true;
            }
        }

        return (used.Count(u => u), rows);
    }

    private static int[] TestCodes(CategoryColumn train, CategoryColumn test)
    {
        var codeOf = new Dictionary<string, int>(train.Levels.Length, StringComparer.Ordinal);
        for (int i = 0; i < train.Levels.Length; i++)
        {
            codeOf[train.Levels[i]] = i;
        }

        var map = test.Levels.Select(l => codeOf.TryGetValue(l, out int at) ? at : TrialCategory.Unseen).ToArray();
        return [.. test.Codes.Select(code => code < 0 ? code : map[code])];
    }
}
