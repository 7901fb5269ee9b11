namespace Foldwise.Core.Spaces;

/// <summary>How a parameter's values are laid out.</summary>
public enum ParameterKind
{
    /// <summary>Whole numbers from Low to High inclusive.</summary>
    Integer,

    /// <summary>Reals from Low to High, sampled evenly.</summary>
    Float,

    /// <summary>Reals from Low to High (both &gt; 0), sampled evenly in log space.</summary>
    LogFloat,

    /// <summary>One of a list of named choices; the value is the choice's index.</summary>
    Choice,
}
