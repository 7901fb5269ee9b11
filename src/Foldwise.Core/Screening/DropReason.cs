namespace Foldwise.Core.Screening;

/// <summary>Why screening dropped a training column.</summary>
public enum DropReason
{
    /// <summary>Every training cell holds the same value.</summary>
    Constant,

    /// <summary>Its cells equal an earlier kept column's, cell for cell.</summary>
    Duplicate,

    /// <summary>Fewer non-zero training cells than the screening minimum.</summary>
    TooFewNonZero,
}
