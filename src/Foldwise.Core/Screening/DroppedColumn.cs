namespace Foldwise.Core.Screening;

/// <summary>A column screening removed; <see cref="SameAs"/> names the kept column a duplicate repeats.</summary>
public sealed record DroppedColumn(string Name, DropReason Reason, string? SameAs = null);
