namespace Foldwise.Core.Definition;

/// <summary>A 1-based line and column in a definition file; the column counts characters, not bytes.</summary>
internal readonly record struct TextPosition(long Line, int Column);
