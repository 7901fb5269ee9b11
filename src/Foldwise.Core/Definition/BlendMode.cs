namespace Foldwise.Core.Definition;

/// <summary>How blend weights are solved. The default is <see cref="Simplex"/>.</summary>
public enum BlendMode
{
    /// <summary>w ≥ 0 and Σw = 1, exact.</summary>
    Simplex,

    /// <summary>w ≥ 0 only (Lawson–Hanson NNLS).</summary>
    NonNegative,

    /// <summary>Greedy forward selection with replacement (Caruana et al., ICML 2004).</summary>
    Greedy,
}
