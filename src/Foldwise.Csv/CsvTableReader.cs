using Foldwise.Core.Data;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv;

/// <summary>
/// Reads a comma-separated table with a header line into a sparse <see cref="FeatureTable"/>: one id column,
/// an optional target column, numeric features of which only non-zero cells are kept (a missing cell is NaN),
/// and category columns (text, or declared in <see cref="TableRules.Categories"/>) as level codes.
/// Rows are streamed, so memory follows the non-zero cells, not the file's size.
/// </summary>
/// <remarks>
/// Every problem with the file is an <see cref="InputException"/> naming the file and, for a cell, its line
/// (the header is line 1) and column (1-based). Lines count CSV records, which equals file lines unless a
/// quoted field spans lines. Blank lines are skipped; an empty cell or a missing-value word is a missing cell.
/// </remarks>
public static class CsvTableReader
{
    /// <summary>Reads a training table; every target must be one the metric can score.</summary>
    /// <param name="bytesRead">Told every few thousand rows the bytes read so far and the file's length.</param>
    public static FeatureTable ReadTraining(string path, string idColumn, string targetColumn, Metric metric, TableRules? rules = null, Action<long, long>? bytesRead = null)
    {
        ArgumentException.ThrowIfNullOrEmpty(targetColumn);
        ArgumentNullException.ThrowIfNull(metric);
        if (string.Equals(idColumn, targetColumn, StringComparison.Ordinal))
        {
            throw new ArgumentException($"the id and target columns must differ, not both '{idColumn}'", nameof(targetColumn));
        }

        return TableLoader.Load(path, idColumn, targetColumn, TargetUse.Required, metric, rules ?? TableRules.Default, training: null, bytesRead);
    }

    /// <summary>Reads a test table on its own; a target column, when named and present, is skipped, not read.</summary>
    public static FeatureTable ReadTest(string path, string idColumn, string? targetColumn, TableRules? rules = null) =>
        TableLoader.Load(path, idColumn, targetColumn, TargetUse.IgnoredIfPresent, metric: null, rules ?? TableRules.Default, training: null);

    /// <summary>
    /// Reads a test table for a training table: the training table's category columns are read as categories here, and a
    /// column that is numeric in one table and text in the other is an <see cref="InputException"/> naming both files.
    /// </summary>
    public static FeatureTable ReadTest(string path, string idColumn, string? targetColumn, TableRules rules, FeatureTable train, Action<long, long>? bytesRead = null)
    {
        ArgumentNullException.ThrowIfNull(rules);
        ArgumentNullException.ThrowIfNull(train);
        var declared = rules.Categories.ToHashSet(StringComparer.Ordinal);
        var textCategories = Enumerable.Range(0, train.CategoryNames.Length)
            .Where(c => !declared.Contains(train.CategoryNames[c]) && train.Categories[c].Levels.Any(IsText))
            .Select(c => train.CategoryNames[c]);
        var training = new TrainingColumns(
            train.Source,
            train.CategoryNames.ToHashSet(StringComparer.Ordinal),
            textCategories.ToHashSet(StringComparer.Ordinal),
            train.FeatureNames.ToHashSet(StringComparer.Ordinal));
        return TableLoader.Load(path, idColumn, targetColumn, TargetUse.IgnoredIfPresent, metric: null, rules, training, bytesRead);
    }

    private static bool IsText(string level) =>
        !float.TryParse(level, System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out _);
}
