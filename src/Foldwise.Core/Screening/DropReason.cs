namespace Foldwise.Core.Screening;

/// <summary>Why screening dropped a training column.</summary>
public enum DropReason
{
    /// <summary>Every training cell holds the same value.</summary>
    Constant,

    /// <summary>Its cells equal an earlier kept column's, cell for cell.</summary>
    Duplicate,

    /// <summary>Fewer non-zero training cells than the screening minimum (missing cells do not count).</summary>
    TooFewNonZero,

    /// <summary>Every training cell is missing.</summary>
    AllMissing,

    /// <summary>A category column whose levels are nearly all unique (free text or an id in disguise).</summary>
    NearlyUnique,
}
