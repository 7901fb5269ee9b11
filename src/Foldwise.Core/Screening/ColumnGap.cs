namespace Foldwise.Core.Screening;

/// <summary>A kept numeric column with missing training cells and the share missing; learners that cannot take NaN impute it inside each fold.</summary>
public sealed record ColumnGap(string Name, double MissingShare);
