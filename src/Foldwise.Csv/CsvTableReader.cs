using Foldwise.Core.Data;
using Foldwise.Core.Metrics;

namespace Foldwise.Csv;

/// <summary>
/// Reads a comma-separated table with a header line into a sparse <see cref="FeatureTable"/>: one id column,
/// an optional target column, and every other column a float feature of which only non-zero cells are kept.
/// Rows are streamed, so memory follows the non-zero cells, not the file's size.
/// </summary>
/// <remarks>
/// Every problem with the file is an <see cref="InputException"/> naming the file and, for a cell, its line
/// (the header is line 1) and column (1-based). Lines count CSV records, which equals file lines unless a
/// quoted field spans lines. Blank lines are skipped; an empty cell in a numeric column is an error.
/// </remarks>
public static class CsvTableReader
{
    /// <summary>Reads a training table; every target must be one the metric can score.</summary>
    public static FeatureTable ReadTraining(string path, string idColumn, string targetColumn, Metric metric)
    {
        ArgumentException.ThrowIfNullOrEmpty(targetColumn);
        ArgumentNullException.ThrowIfNull(metric);
        if (string.Equals(idColumn, targetColumn, StringComparison.Ordinal))
        {
            throw new ArgumentException($"the id and target columns must differ, not both '{idColumn}'", nameof(targetColumn));
        }

        return TableLoader.Load(path, idColumn, targetColumn, TargetUse.Required, metric);
    }

    /// <summary>Reads a test table; a target column, when named and present, is skipped, not read.</summary>
    public static FeatureTable ReadTest(string path, string idColumn, string? targetColumn) =>
        TableLoader.Load(path, idColumn, targetColumn, TargetUse.IgnoredIfPresent, metric: null);
}
