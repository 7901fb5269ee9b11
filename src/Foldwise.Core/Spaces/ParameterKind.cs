namespace Foldwise.Core.Spaces;

/// <summary>How a parameter's values are laid out; each member is spelled in a definition file as its range word.</summary>
public enum ParameterKind
{
    /// <summary>Whole numbers from Low to High inclusive (<c>whole</c>).</summary>
    Whole,

    /// <summary>Reals from Low to High, sampled evenly (<c>linear</c>).</summary>
    Linear,

    /// <summary>Reals from Low to High (both &gt; 0), sampled evenly in log space (<c>log</c>).</summary>
    Log,

    /// <summary>One of a list of names; the value is the name's index (<c>one_of</c>).</summary>
    OneOf,
}
