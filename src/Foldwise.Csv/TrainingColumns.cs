namespace Foldwise.Csv;

/// <summary>What a test table's reader must know of the training table: its file, its category columns, and which of them hold text (not only numbers).</summary>
internal sealed record TrainingColumns(string Path, IReadOnlySet<string> Categories, IReadOnlySet<string> TextCategories, IReadOnlySet<string> Numeric);
