namespace Foldwise.Core.Data;

/// <summary>Matches a test table's features to the training table's, by name.</summary>
public static class TableAlignment
{
    /// <summary>
    /// The test table with exactly the training features and category columns, in training order. A training feature the test
    /// table lacks is an <see cref="InputException"/> naming the test file; extra test columns are dropped
    /// and listed, in test-file order.
    /// </summary>
    public static AlignedTest AlignTest(FeatureTable train, FeatureTable test)
    {
        ArgumentNullException.ThrowIfNull(train);
        ArgumentNullException.ThrowIfNull(test);
        var indexOf = new Dictionary<string, int>(test.FeatureCount, StringComparer.Ordinal);
        for (int i = 0; i < test.FeatureCount; i++)
        {
            indexOf.TryAdd(test.FeatureNames[i], i);
        }

        var picked = new int[train.FeatureCount];
        for (int f = 0; f < train.FeatureCount; f++)
        {
            string name = train.FeatureNames[f];
            picked[f] = indexOf.TryGetValue(name, out int at)
                ? at
                : throw new InputException(test.Source, $"the test table has no column '{name}', which the training table has");
        }

        var categoryOf = new Dictionary<string, int>(test.CategoryNames.Length, StringComparer.Ordinal);
        for (int i = 0; i < test.CategoryNames.Length; i++)
        {
            categoryOf.TryAdd(test.CategoryNames[i], i);
        }

        var pickedCategories = new int[train.CategoryNames.Length];
        for (int c = 0; c < pickedCategories.Length; c++)
        {
            string name = train.CategoryNames[c];
            pickedCategories[c] = categoryOf.TryGetValue(name, out int at)
                ? at
                : throw new InputException(test.Source, $"the test table has no category column '{name}', which the training table has");
        }

        var used = new HashSet<int>(picked);
        var usedCategories = new HashSet<int>(pickedCategories);
        var extra = Enumerable.Range(0, test.FeatureCount).Where(i => !used.Contains(i)).Select(i => test.FeatureNames[i])
            .Concat(Enumerable.Range(0, test.CategoryNames.Length).Where(i => !usedCategories.Contains(i)).Select(i => test.CategoryNames[i]));
        return new AlignedTest(test.WithColumns(picked).WithCategories(pickedCategories), [.. extra]);
    }
}
