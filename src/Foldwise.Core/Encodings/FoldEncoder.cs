using System.Collections.Immutable;
using Foldwise.Core.Learning;

namespace Foldwise.Core.Encodings;

/// <summary>
/// Encodes a trial's category columns for one fold, fitting everything on the fold's training rows only: the slots
/// (kept levels, missing, "other") come from their level counts, and a target mean from their fitting-scale targets.
/// A training row's target mean comes from the other inner folds of those rows, so its own target never enters it;
/// validation and test rows use all the fold's training rows. Encoded columns follow the numeric ones, in column order.
/// </summary>
public static class FoldEncoder
{
    /// <param name="fewLevels">
    /// What a few-level column (<see cref="CategoryEncodingKind.Indicators"/> by its level count) becomes for the family
    /// that reads these inputs: indicator columns, or one <see cref="CategoryEncodingKind.LevelCodes"/> column.
    /// </param>
    public static FoldInputs Prepare(
        TrialData data, ImmutableArray<int> trainRows, int seed, EncodingOptions options, CategoryEncodingKind fewLevels = CategoryEncodingKind.Indicators)
    {
        ArgumentNullException.ThrowIfNull(data);
        ArgumentNullException.ThrowIfNull(options);
        if (fewLevels == CategoryEncodingKind.TargetMean)
        {
            throw new ArgumentOutOfRangeException(nameof(fewLevels), fewLevels, "few-level columns become indicators or level codes");
        }

        var categories = data.Categories;
        if (categories.IsDefaultOrEmpty)
        {
            return FoldInputs.Plain(data);
        }

        var train = new ExtraCells(data.Train.RowCount, categories.Length);
        var test = new ExtraCells(data.Test.RowCount, categories.Length);
        var codeColumns = ImmutableArray.CreateBuilder<int>();
        int offset = data.Train.ColumnCount;
        for (int g = 0; g < categories.Length; g++)
        {
            var category = categories[g];
            var slots = LevelSlots.Fit(category, trainRows, options.MinLevelCount);
            if (category.Kind == CategoryEncodingKind.Indicators && fewLevels == CategoryEncodingKind.LevelCodes)
            {
                // Slot 0 is an absent cell: the value zero, which is the code of slot 0.
                Codes(category.Train, slots, train, g, offset);
                Codes(category.Test, slots, test, g, offset);
                codeColumns.Add(offset++);
                continue;
            }

            if (category.Kind == CategoryEncodingKind.Indicators)
            {
                Indicators(category.Train, slots, train, g, offset);
                Indicators(category.Test, slots, test, g, offset);
                offset += slots.Count;
                continue;
            }

            var means = new SlotMeans(slots, category.Train, data.Target, options);
            var all = means.Fit(trainRows);
            Fill(category.Train, slots, all, train, g, offset);
            Fill(category.Test, slots, all, test, g, offset);
            foreach (var (fitted, encoded) in InnerFolds(trainRows, options.InnerFolds, seed))
            {
                var inner = means.Fit(fitted);
                foreach (int row in encoded)
                {
                    train.Set(row, g, offset, (float)inner[slots.Of(category.Train[row])]);
                }
            }

            offset++;
        }

        return new FoldInputs(train.AppendTo(data.Train, offset), test.AppendTo(data.Test, offset)) { LevelCodeColumns = codeColumns.ToImmutable() };
    }

    /// <summary>The fold's training rows split into inner folds by a seeded shuffle: (rows fitted on, rows encoded) for each.</summary>
    internal static IEnumerable<(int[] Fitted, int[] Encoded)> InnerFolds(ImmutableArray<int> trainRows, int folds, int seed)
    {
        var shuffled = trainRows.ToArray();
        new Random(seed).Shuffle(shuffled);
        int k = Math.Min(folds, shuffled.Length);
        for (int j = 0; j < k; j++)
        {
            var encoded = shuffled.Where((_, i) => i % k == j).ToArray();
            var fitted = shuffled.Where((_, i) => i % k != j).ToArray();
            yield return (fitted, encoded);
        }
    }

    private static void Indicators(int[] codes, LevelSlots slots, ExtraCells cells, int group, int offset)
    {
        for (int r = 0; r < codes.Length; r++)
        {
            cells.Set(r, group, offset + slots.Of(codes[r]), 1f);
        }
    }

    private static void Codes(int[] codes, LevelSlots slots, ExtraCells cells, int group, int offset)
    {
        for (int r = 0; r < codes.Length; r++)
        {
            cells.Set(r, group, offset, slots.Of(codes[r]));
        }
    }

    private static void Fill(int[] codes, LevelSlots slots, double[] values, ExtraCells cells, int group, int offset)
    {
        for (int r = 0; r < codes.Length; r++)
        {
            cells.Set(r, group, offset, (float)values[slots.Of(codes[r])]);
        }
    }
}
