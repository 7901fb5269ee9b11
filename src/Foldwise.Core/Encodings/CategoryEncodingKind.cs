namespace Foldwise.Core.Encodings;

/// <summary>How a category column reaches the learners.</summary>
public enum CategoryEncodingKind
{
    /// <summary>One 0/1 column per kept level (sparse), plus missing and "other" where they occur.</summary>
    Indicators,

    /// <summary>One column: the smoothed mean of the fitting-scale target of the row's level, out-of-fold for training rows.</summary>
    TargetMean,

    /// <summary>
    /// One column holding the row's slot (kept level, missing or "other", numbered from 0), declared categorical to a
    /// learner that groups levels inside its own splits (LightGBM's category splits). A few-level column's alternative to
    /// <see cref="Indicators"/>; only a family that can split on categories reads it.
    /// </summary>
    LevelCodes,
}
