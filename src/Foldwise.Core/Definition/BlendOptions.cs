namespace Foldwise.Core.Definition;

/// <summary>The final stage. The default blends the best <c>3</c> full-budget trials of each family on the simplex.</summary>
public sealed record BlendOptions(BlendMode Mode = BlendMode.Simplex, int Pool = 3);
