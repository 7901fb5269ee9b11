namespace Foldwise.Core.Screening;

/// <summary>Which training columns are dropped before any trial. The default drops columns with fewer than <c>3</c> non-zero cells.</summary>
/// <param name="MinNonZero">A column needs at least this many non-zero training cells to be kept.</param>
public sealed record ScreeningOptions(int MinNonZero = 3);
