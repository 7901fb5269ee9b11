namespace Foldwise.Core.Data;

/// <summary>Matches a test table's features to the training table's, by name.</summary>
public static class TableAlignment
{
    /// <summary>
    /// The test table with exactly the training features, in training order. A training feature the test
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

        var used = new HashSet<int>(picked);
        var extra = Enumerable.Range(0, test.FeatureCount).Where(i => !used.Contains(i)).Select(i => test.FeatureNames[i]);
        return new AlignedTest(test.WithColumns(picked), [.. extra]);
    }
}
