namespace Foldwise.Core.Definition;

/// <summary>The search's tables and the two columns that are not features. Paths are absolute once a definition is read.</summary>
public sealed record DataSource(string Train, string Test, string IdColumn, string TargetColumn);
