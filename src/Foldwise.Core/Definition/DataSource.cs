using Foldwise.Core.Data;

namespace Foldwise.Core.Definition;

/// <summary>The search's tables, the two columns that are not features, and how cells are read. Paths are absolute once a definition is read.</summary>
public sealed record DataSource(string Train, string Test, string IdColumn, string TargetColumn)
{
    /// <summary>Missing-value words, declared category columns and ignored columns; the default is <see cref="TableRules.Default"/>.</summary>
    public TableRules Rules { get; init; } = TableRules.Default;
}
